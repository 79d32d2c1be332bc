import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { ArrayMaxSize, IsArray, IsNumber, IsString, Max, MaxLength, Min, MinLength, ValidateNested } from 'class-validator';
import type { CreateWeatherStationRequest, ZoneStationWeightsRequest } from '@morrowline/shared';
import { IsInstantDate } from '../../common/validation/is-instant';
import { IsOptional, IsOptionalOrNull } from '../../common/validation/is-optional';
import { ZoneCodeList } from '../../common/validation/zone-code-list';
import { IsTimeZone } from '../../zones/dto/is-time-zone.validator';
import { IsStationCode } from './station-code';

export class CreateWeatherStationDto implements CreateWeatherStationRequest {
  @ApiProperty({ example: 'VALLEYFLOOR' }) @IsStationCode()
  code!: string;

  @ApiProperty() @IsString() @MinLength(1) @MaxLength(120)
  name!: string;

  @ApiProperty({ example: 'America/Denver' }) @IsTimeZone()
  timeZone!: string;

  @ApiPropertyOptional() @IsOptionalOrNull() @IsNumber() @Min(-90) @Max(90)
  latitude?: number | null;

  @ApiPropertyOptional() @IsOptionalOrNull() @IsNumber() @Min(-180) @Max(180)
  longitude?: number | null;

  @ApiPropertyOptional({ description: 'metres above sea level' }) @IsOptionalOrNull() @IsNumber() @Min(-500) @Max(9000)
  elevationM?: number | null;
}

export class StationWeightDto {
  @ApiProperty({ example: 'VALLEYFLOOR' }) @IsStationCode()
  station!: string;

  @ApiProperty({ example: 0.6, description: 'share of the zone\'s temperature; the weights are normalised' }) @IsNumber() @Min(0.001) @Max(1000)
  weight!: number;
}

export class ZoneStationWeightsDto implements ZoneStationWeightsRequest {
  @ApiProperty({ type: [StationWeightDto] })
  @IsArray()
  @ArrayMaxSize(20)
  @ValidateNested({ each: true })
  @Type(() => StationWeightDto)
  stations!: StationWeightDto[];
}

export class ZoneWeatherQueryDto {
  @ZoneCodeList('Zone code(s), comma-separated or repeated')
  zone?: string[];

  @ApiPropertyOptional({ description: 'First hour (inclusive); default 48 hours ago' }) @IsOptional() @IsInstantDate()
  from?: Date;

  @ApiPropertyOptional({ description: 'End (exclusive); default 7 days ahead' }) @IsOptional() @IsInstantDate()
  to?: Date;

  @ApiPropertyOptional({ description: 'Forecasts as known at this time: only vintages issued at or before it; default now' }) @IsOptional() @IsInstantDate()
  asOf?: Date;
}

export class WeatherExportQueryDto {
  @ApiProperty({ example: 'VALLEYFLOOR' }) @IsStationCode()
  station!: string;

  @ApiPropertyOptional({ description: 'Observed: first hour; forecasts: first issue time. Default 31 days before `to`' }) @IsOptional() @IsInstantDate()
  from?: Date;

  @ApiPropertyOptional({ description: 'End (exclusive); default now' }) @IsOptional() @IsInstantDate()
  to?: Date;
}
