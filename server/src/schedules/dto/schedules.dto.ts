import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { ArrayMaxSize, ArrayMinSize, IsArray, IsEmail, IsIn, IsInt, IsNumber, IsString, Max, MaxLength, Min, MinLength } from 'class-validator';
import { IsOptional, IsOptionalOrNull } from '../../common/validation/is-optional';
import {
  SCHEDULE_ADJUSTMENT_KINDS,
  type CreateScheduleAdjustmentRequest,
  type CreateScheduleCorrectionRequest,
  type CreateScheduleSubscriberRequest,
  type ReturnScheduleRequest,
  type ScheduleAdjustmentKind,
  type SubmitScheduleRequest,
} from '@morrowline/shared';
import { IsZoneCode } from '../../common/validation/is-zone-code';

const trim = ({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value);

export class CreateAdjustmentDto implements CreateScheduleAdjustmentRequest {
  @ApiProperty({ type: [String] })
  @IsArray() @ArrayMinSize(1, { message: 'name at least one zone' }) @ArrayMaxSize(50)
  @IsZoneCode({ each: true })
  zones!: string[];

  @ApiProperty({ enum: SCHEDULE_ADJUSTMENT_KINDS })
  @IsIn([...SCHEDULE_ADJUSTMENT_KINDS], { message: `kind must be one of ${SCHEDULE_ADJUSTMENT_KINDS.join(', ')}` })
  kind!: ScheduleAdjustmentKind;

  @ApiProperty({ description: 'first hour, 0-based position in the operating day' })
  @IsInt() @Min(0) @Max(24)
  fromHour!: number;

  @ApiProperty({ description: 'last hour, inclusive' })
  @IsInt() @Min(0) @Max(24)
  toHour!: number;

  @ApiProperty({ description: 'MW for set and add, percent for scale' })
  @IsNumber({ allowNaN: false, allowInfinity: false }) @Min(-100000) @Max(100000)
  value!: number;

  @ApiProperty()
  @Transform(trim) @IsString() @MinLength(3, { message: 'give a reason for the adjustment (at least 3 characters)' }) @MaxLength(2000)
  reason!: string;
}

export class SubmitScheduleDto implements SubmitScheduleRequest {
  @ApiPropertyOptional() @IsOptional() @Transform(trim) @IsString() @MaxLength(2000)
  comment?: string;
}

export class ReturnScheduleDto implements ReturnScheduleRequest {
  @ApiProperty()
  @Transform(trim) @IsString() @MinLength(3, { message: 'say why the schedule goes back (at least 3 characters)' }) @MaxLength(2000)
  comment!: string;
}

export class CreateCorrectionDto implements CreateScheduleCorrectionRequest {
  @ApiProperty()
  @Transform(trim) @IsString() @MinLength(3, { message: 'give a reason for the correction (at least 3 characters)' }) @MaxLength(2000)
  reason!: string;
}

export class CreateSubscriberDto implements CreateScheduleSubscriberRequest {
  @ApiProperty() @Transform(({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim().toLowerCase() : value)) @IsEmail({}, { message: 'email must be an e-mail address' }) @MaxLength(254)
  email!: string;

  @ApiProperty() @Transform(trim) @IsString() @MinLength(1, { message: 'name is required' }) @MaxLength(120)
  name!: string;

  @ApiPropertyOptional({ type: [String], nullable: true, description: 'zone codes; omit or null for every zone' })
  @IsOptionalOrNull() @IsArray() @ArrayMinSize(1, { message: 'zones: name at least one, or leave it out for every zone' }) @ArrayMaxSize(50)
  @IsZoneCode({ each: true })
  zones?: string[] | null;
}

export class DayQueryDto {
  @ApiPropertyOptional({ description: 'zone codes, comma-separated; all active zones if left out' })
  @IsOptional()
  @Transform(({ value }: { value: unknown }) => (typeof value === 'string' ? value.split(',').map((s) => s.trim()).filter(Boolean) : value))
  @IsArray() @IsZoneCode({ each: true })
  zone?: string[];
}

export class ExportQueryDto {
  @ApiPropertyOptional({ enum: ['csv', 'json'] })
  @IsOptional() @IsIn(['csv', 'json'], { message: 'format must be csv or json' })
  format: 'csv' | 'json' = 'csv';
}
