import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Transform, Type } from 'class-transformer';
import { ArrayMaxSize, IsArray, IsDate, IsOptional } from 'class-validator';
import { IsZoneCode } from '../../common/validation/is-zone-code';

export class CommittedQueryDto {
  @ApiPropertyOptional({ description: 'comma-separated zone codes; every active zone when omitted', example: 'MILLRACE,HARROW' })
  @IsOptional()
  @Transform(({ value }) => (Array.isArray(value) ? value : String(value).split(',')).map((v: string) => v.trim()).filter(Boolean))
  @IsArray()
  @ArrayMaxSize(50)
  @IsZoneCode({ each: true })
  zone?: string[];

  @ApiProperty({ description: 'First hour (UTC), ISO 8601', example: '2026-12-01T07:00:00Z' })
  @Type(() => Date) @IsDate({ message: 'from must be a time' })
  from!: Date;

  @ApiProperty({ description: 'End of the last hour (UTC, exclusive), ISO 8601', example: '2026-12-03T07:00:00Z' })
  @Type(() => Date) @IsDate({ message: 'to must be a time' })
  to!: Date;
}
