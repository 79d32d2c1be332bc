import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { ArrayMaxSize, IsArray, IsIn, IsInt, Max, Min, IsString, MaxLength, MinLength, ValidateNested } from 'class-validator';
import { IsInstantDate } from '../../common/validation/is-instant';
import { ToInteger } from '../../common/validation/to-integer';
import { IsOptional, IsOptionalOrNull } from '../../common/validation/is-optional';
import {
  HANDOVER_ITEM_KINDS,
  HANDOVER_ITEM_STATUSES,
  type AcknowledgeHandoverRequest,
  type CreateHandoverRequest,
  type HandoverItemInput,
  type HandoverItemKind,
  type HandoverItemStatus,
} from '@morrowline/shared';
import { IsZoneCode } from '../../common/validation/is-zone-code';

export class HandoverItemDto implements HandoverItemInput {
  @ApiProperty({ enum: HANDOVER_ITEM_KINDS })
  @IsIn([...HANDOVER_ITEM_KINDS], { message: `kind must be one of ${HANDOVER_ITEM_KINDS.join(', ')}` })
  kind!: HandoverItemKind;

  @ApiPropertyOptional() @IsOptionalOrNull() @IsZoneCode()
  zoneCode?: string | null;

  @ApiProperty() @IsString() @MinLength(1, { message: 'each item needs a line of text' }) @MaxLength(2000)
  text!: string;

  @ApiProperty({ enum: HANDOVER_ITEM_STATUSES })
  @IsIn([...HANDOVER_ITEM_STATUSES], { message: 'status must be open or closed' })
  status!: HandoverItemStatus;

  @ApiPropertyOptional() @IsOptionalOrNull() @IsInt()
  carriedFromItemId?: number | null;
}

export class CreateHandoverDto implements CreateHandoverRequest {
  @ApiProperty() @IsString() @MaxLength(20000)
  body!: string;

  @ApiProperty({ type: [HandoverItemDto] })
  @IsArray() @ArrayMaxSize(100) @ValidateNested({ each: true }) @Type(() => HandoverItemDto)
  items!: HandoverItemDto[];
}

export class AcknowledgeHandoverDto implements AcknowledgeHandoverRequest {
  @ApiPropertyOptional() @IsOptional() @IsString() @MaxLength(5000)
  reply?: string;
}

export class HandoverSearchDto {
  @IsOptional() @IsString() @MaxLength(200) q?: string;
  @IsOptional() @IsZoneCode() zone?: string;
  @IsOptional() @IsInstantDate() from?: Date;
  @IsOptional() @IsInstantDate() to?: Date;
  @IsOptional() @ToInteger() @IsInt() @Min(1) @Max(100) limit: number = 20;
  @IsOptional() @ToInteger() @IsInt() @Min(0) offset: number = 0;
}
