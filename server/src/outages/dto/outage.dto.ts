import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsDate, IsIn, IsISO8601, IsOptional, IsString, MaxLength, MinLength, ValidateIf } from 'class-validator';
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
  @IsISO8601({ strict: true }, { message: 'start must be an ISO 8601 time' })
  start!: string;

  @ApiPropertyOptional({ description: 'omit or null while the window is still open' })
  @IsOptional() @ValidateIf((o: CreateOutageDto) => o.end !== null) @IsISO8601({ strict: true }, { message: 'end must be an ISO 8601 time or null' })
  end?: string | null;

  @ApiProperty({ example: 'Feeder 12 tripped at the Copperline substation' })
  @IsString() @MinLength(1, { message: 'a note is needed: what happened' }) @MaxLength(2000)
  note!: string;
}

export class UpdateOutageDto implements UpdateOutageRequest {
  @ApiPropertyOptional({ enum: OUTAGE_KINDS })
  @IsOptional() @IsIn([...OUTAGE_KINDS], { message: KIND_MESSAGE })
  kind?: OutageKind;

  @IsOptional() @IsISO8601({ strict: true }, { message: 'start must be an ISO 8601 time' })
  start?: string;

  @IsOptional() @ValidateIf((o: UpdateOutageDto) => o.end !== null) @IsISO8601({ strict: true }, { message: 'end must be an ISO 8601 time or null' })
  end?: string | null;

  @IsOptional() @IsString() @MinLength(1) @MaxLength(2000)
  note?: string;

  @ApiProperty({ example: 'Restoration took longer than logged' })
  @IsString() @MinLength(1, { message: 'a reason is needed for the change' }) @MaxLength(1000)
  reason!: string;
}

export class CloseOutageDto implements CloseOutageRequest {
  @IsOptional() @IsISO8601({ strict: true }, { message: 'end must be an ISO 8601 time' })
  end?: string;

  @IsOptional() @IsString() @MaxLength(1000)
  reason?: string;
}

export class OutagesQueryDto {
  @ApiPropertyOptional({ example: 'MILLRACE' })
  @IsOptional() @IsZoneCode()
  zone?: string;

  @IsOptional() @Type(() => Date) @IsDate({ message: 'from must be a time' })
  from?: Date;

  @IsOptional() @Type(() => Date) @IsDate({ message: 'to must be a time' })
  to?: Date;
}
