import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsInstantDate } from '../../common/validation/is-instant';
import { IsOptional } from '../../common/validation/is-optional';
import { IsZoneCode } from '../../common/validation/is-zone-code';
import { ZoneCodeList } from '../../common/validation/zone-code-list';

/** `zone` may repeat or be comma-separated; absent means every active zone. */
export class ReadingsQueryDto {
  @ZoneCodeList('Zone code(s), comma-separated or repeated', 'MILLRACE,HARROW')
  zone?: string[];

  @ApiPropertyOptional({ description: 'First hour (UTC, inclusive); default 7 days before `to`' })
  @IsOptional() @IsInstantDate()
  from?: Date;

  @ApiPropertyOptional({ description: 'End (exclusive); default the end of the current hour' })
  @IsOptional() @IsInstantDate()
  to?: Date;
}

export class ReadingsExportQueryDto {
  @ApiPropertyOptional({ example: 'MILLRACE' })
  @IsZoneCode()
  zone!: string;

  @IsOptional() @IsInstantDate()
  from?: Date;

  @IsOptional() @IsInstantDate()
  to?: Date;
}

export class ReadingsUploadQueryDto {
  @ApiPropertyOptional({ description: 'Zone for rows without a zone column', example: 'MILLRACE' })
  @IsOptional()
  @IsZoneCode()
  zone?: string;
}
