import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsString, MaxLength, MinLength } from 'class-validator';
import { IsOptional, IsOptionalOrNull } from '../../common/validation/is-optional';
import type { CreateFeedKeyRequest } from '@morrowline/shared';
import { IsZoneCode } from '../../common/validation/is-zone-code';
import { IsStationCode } from '../../weather/dto/station-code';

export class CreateFeedKeyDto implements CreateFeedKeyRequest {
  @ApiProperty({ example: 'Millrace substation RTU' })
  @IsString() @MinLength(1) @MaxLength(80)
  name!: string;

  @ApiPropertyOptional({ description: 'Limit the key to one zone', example: 'MILLRACE' })
  @IsOptionalOrNull()
  @IsZoneCode()
  zone?: string | null;

  @ApiPropertyOptional({ description: 'Limit the key to one weather station (weather only)', example: 'VALLEYFLOOR' })
  @IsOptionalOrNull()
  @IsStationCode()
  station?: string | null;
}

export class RevokeFeedKeyDto {
  @ApiPropertyOptional() @IsOptional() @IsString() @MaxLength(500)
  reason?: string;
}
