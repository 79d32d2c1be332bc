import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { ArrayMaxSize, IsArray, IsOptional, Matches } from 'class-validator';
import { IsZoneCode } from '../../common/validation/is-zone-code';

const DAY = /^\d{4}-\d{2}-\d{2}$/;

export class AccuracyQueryDto {
  @ApiPropertyOptional({ description: 'Zone code(s), comma-separated or repeated; every active zone when omitted', example: 'MILLRACE,HARROW' })
  @IsOptional()
  @Transform(({ value }) => (Array.isArray(value) ? value : String(value).split(',')).map((v: string) => v.trim()).filter(Boolean))
  @IsArray()
  @ArrayMaxSize(50)
  @IsZoneCode({ each: true })
  zone?: string[];

  @ApiProperty({ description: 'First operating day, yyyy-MM-dd (included)', example: '2026-11-01' })
  @Matches(DAY, { message: 'from must be an operating day, yyyy-MM-dd' })
  from!: string;

  @ApiProperty({ description: 'Last operating day, yyyy-MM-dd (included)', example: '2026-11-30' })
  @Matches(DAY, { message: 'to must be an operating day, yyyy-MM-dd' })
  to!: string;
}
