import { ApiProperty, ApiPropertyOptional, PartialType } from '@nestjs/swagger';
import { ArrayMaxSize, IsArray, IsIn, IsString, MaxLength, MinLength } from 'class-validator';
import { SPECIAL_DAY_KINDS, type SpecialDayKind, type SpecialDayRequest } from '@morrowline/shared';
import { IsDay } from '../../common/validation/is-instant';
import { IsOptional } from '../../common/validation/is-optional';
import { IsZoneCode } from '../../common/validation/is-zone-code';

export class SpecialDayDtoIn implements SpecialDayRequest {
  @ApiProperty({ example: '2026-12-24' }) @IsDay()
  day!: string;

  @ApiProperty({ example: 'Winter Eve' }) @IsString() @MinLength(1) @MaxLength(120)
  name!: string;

  @ApiProperty({ enum: SPECIAL_DAY_KINDS }) @IsIn([...SPECIAL_DAY_KINDS], { message: `kind must be one of ${SPECIAL_DAY_KINDS.join(', ')}` })
  kind!: SpecialDayKind;

  @ApiPropertyOptional({ description: 'Zone codes the day applies to; left out or empty for every zone', example: ['LANTERN'] })
  @IsOptional() @IsArray() @ArrayMaxSize(50) @IsZoneCode({ each: true })
  zones?: string[];
}

export class SpecialDayPatchDto extends PartialType(SpecialDayDtoIn, { skipNullProperties: false }) {
  @ApiPropertyOptional() @IsOptional() @IsString() @MaxLength(500)
  reason?: string;
}

export class SpecialDaysQueryDto {
  @ApiPropertyOptional({ description: 'First local day (inclusive); default 1 January of this year' }) @IsOptional() @IsDay()
  from?: string;

  @ApiPropertyOptional({ description: 'Last local day (inclusive); default 31 December of next year' }) @IsOptional() @IsDay()
  to?: string;
}

