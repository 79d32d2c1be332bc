import { ApiProperty, ApiPropertyOptional, PartialType, OmitType } from '@nestjs/swagger';
import { IsBoolean, IsInt, IsNumber, IsString, Matches, Max, MaxLength, Min, MinLength } from 'class-validator';
import { IsOptional } from '../../common/validation/is-optional';
import { ZONE_CODE_RULE, type CreateZoneRequest, type UpdateZoneRequest } from '@morrowline/shared';
import { IsZoneCode } from '../../common/validation/is-zone-code';
import { IsTimeZone } from './is-time-zone.validator';

export class CreateZoneDto implements CreateZoneRequest {
  @ApiProperty({ example: 'MILLRACE', description: ZONE_CODE_RULE })
  @IsZoneCode()
  code!: string;

  @ApiProperty() @IsString() @MinLength(1) @MaxLength(120)
  name!: string;

  @ApiProperty({ example: 'America/Denver' }) @IsTimeZone()
  timeZone!: string;

  @ApiProperty() @IsNumber() @Min(0.1) @Max(100)
  alertThresholdPct!: number;

  @ApiProperty() @IsInt() @Min(1) @Max(48)
  alertConsecutiveHours!: number;

  @ApiProperty({ example: '10:00' })
  @Matches(/^([01]\d|2[0-3]):[0-5]\d$/, { message: 'gateClosure must be a local time HH:mm' })
  gateClosure!: string;

  @ApiProperty() @IsNumber() @Min(0)
  minPlausibleMw!: number;

  @ApiProperty() @IsNumber() @Min(1) @Max(100000)
  maxPlausibleMw!: number;

  @ApiPropertyOptional() @IsOptional() @IsBoolean()
  active?: boolean;
}

export class UpdateZoneDto extends PartialType(OmitType(CreateZoneDto, ['code'] as const), { skipNullProperties: false }) implements UpdateZoneRequest {
  @ApiPropertyOptional() @IsOptional() @IsString() @MaxLength(500)
  reason?: string;
}
