import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsIn, IsString, MaxLength, MinLength } from 'class-validator';
import { IsInstant, IsInstantDate } from '../../common/validation/is-instant';
import { IsOptional, IsOptionalOrNull } from '../../common/validation/is-optional';
import { OUTAGE_KINDS, type CloseOutageRequest, type CreateOutageRequest, type OutageKind, type UpdateOutageRequest } from '@morrowline/shared';
import { IsZoneCode } from '../../common/validation/is-zone-code';

const KIND_MESSAGE = `kind must be one of ${OUTAGE_KINDS.join(', ')}`;

export class CreateOutageDto implements CreateOutageRequest {
  @ApiProperty({ example: 'COPPERLINE' })
  @IsZoneCode()
  zone!: string;

  @ApiProperty({ enum: OUTAGE_KINDS })
  @IsIn([...OUTAGE_KINDS], { message: KIND_MESSAGE })
  kind!: OutageKind;

  @ApiProperty({ example: '2026-11-30T14:00:00Z' })
  @IsInstant({ notATime: 'start must be an ISO 8601 time' })
  start!: string;

  @ApiPropertyOptional({ description: 'omit or null while the window is still open' })
  @IsOptionalOrNull() @IsInstant({ notATime: 'end must be an ISO 8601 time or null' })
  end?: string | null;

  @ApiProperty({ example: 'Feeder 12 tripped at the Copperline substation' })
  @IsString() @MinLength(1, { message: 'a note is needed: what happened' }) @MaxLength(2000)
  note!: string;
}

export class UpdateOutageDto implements UpdateOutageRequest {
  @ApiPropertyOptional({ enum: OUTAGE_KINDS })
  @IsOptional() @IsIn([...OUTAGE_KINDS], { message: KIND_MESSAGE })
  kind?: OutageKind;

  @IsOptional() @IsInstant({ notATime: 'start must be an ISO 8601 time' })
  start?: string;

  @IsOptionalOrNull() @IsInstant({ notATime: 'end must be an ISO 8601 time or null' })
  end?: string | null;

  @IsOptional() @IsString() @MinLength(1) @MaxLength(2000)
  note?: string;

  @ApiProperty({ example: 'Restoration took longer than logged' })
  @IsString() @MinLength(1, { message: 'a reason is needed for the change' }) @MaxLength(1000)
  reason!: string;
}

export class CloseOutageDto implements CloseOutageRequest {
  @IsOptional() @IsInstant({ notATime: 'end must be an ISO 8601 time' })
  end?: string;

  @IsOptional() @IsString() @MaxLength(1000)
  reason?: string;
}

export class OutagesQueryDto {
  @ApiPropertyOptional({ example: 'MILLRACE' })
  @IsOptional() @IsZoneCode()
  zone?: string;

  @IsOptional() @IsInstantDate({ notATime: 'from must be a time' })
  from?: Date;

  @IsOptional() @IsInstantDate({ notATime: 'to must be a time' })
  to?: Date;
}
