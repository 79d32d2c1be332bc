import { ApiPropertyOptional } from '@nestjs/swagger';
import { Transform, Type } from 'class-transformer';
import { ArrayMaxSize, IsArray, IsDate, IsOptional } from 'class-validator';
import { IsZoneCode } from '../../common/validation/is-zone-code';

export class LatestForecastsQueryDto {
  @ApiPropertyOptional({ description: 'comma-separated zone codes; all active zones when omitted', example: 'MILLRACE,COPPERLINE' })
  @IsOptional()
  @Transform(({ value }) => (Array.isArray(value) ? value : String(value).split(',')).map((v: string) => v.trim()).filter(Boolean))
  @IsArray()
  @ArrayMaxSize(50)
  @IsZoneCode({ each: true })
  zone?: string[];

  @IsOptional() @Type(() => Date) @IsDate({ message: 'from must be a time' })
  from?: Date;

  @IsOptional() @Type(() => Date) @IsDate({ message: 'to must be a time' })
  to?: Date;
}
