import { ApiPropertyOptional } from '@nestjs/swagger';
import { Transform, Type } from 'class-transformer';
import { ArrayMaxSize, IsArray, IsDate, IsOptional } from 'class-validator';
import { IsZoneCode } from '../../common/validation/is-zone-code';

/** `zone` may repeat or be comma-separated; absent means every active zone. */
export class ReadingsQueryDto {
  @ApiPropertyOptional({ description: 'Zone code(s), comma-separated or repeated', example: 'MILLRACE,HARROW' })
  @IsOptional()
  @Transform(({ value }) => (Array.isArray(value) ? value : String(value).split(',')).map((v: string) => v.trim()).filter(Boolean))
  @IsArray()
  @ArrayMaxSize(50)
  @IsZoneCode({ each: true })
  zone?: string[];

  @ApiPropertyOptional({ description: 'First hour (UTC, inclusive); default 7 days before `to`' })
  @IsOptional() @Type(() => Date) @IsDate({ message: 'from must be an ISO 8601 date and time' })
  from?: Date;

  @ApiPropertyOptional({ description: 'End (exclusive); default the end of the current hour' })
  @IsOptional() @Type(() => Date) @IsDate({ message: 'to must be an ISO 8601 date and time' })
  to?: Date;
}

export class ReadingsExportQueryDto {
  @ApiPropertyOptional({ example: 'MILLRACE' })
  @IsZoneCode()
  zone!: string;

  @IsOptional() @Type(() => Date) @IsDate({ message: 'from must be an ISO 8601 date and time' })
  from?: Date;

  @IsOptional() @Type(() => Date) @IsDate({ message: 'to must be an ISO 8601 date and time' })
  to?: Date;
}

export class ReadingsUploadQueryDto {
  @ApiPropertyOptional({ description: 'Zone for rows without a zone column', example: 'MILLRACE' })
  @IsOptional()
  @IsZoneCode()
  zone?: string;
}
