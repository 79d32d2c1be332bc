import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { IsNumber, IsString, Max, MaxLength, Min, MinLength } from 'class-validator';
import { WHAT_IF_MAX_SHIFT_C, type WeatherWhatIfAdjustRequest } from '@morrowline/shared';
import { IsOptional } from '../../common/validation/is-optional';

const trim = ({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value);

/** The what-if to turn into adjustments (exactly one of shift and vintage, checked by the controller) and why. */
export class WeatherWhatIfAdjustDto implements WeatherWhatIfAdjustRequest {
  @ApiPropertyOptional({ description: `°C added to the temperature forecast, −${WHAT_IF_MAX_SHIFT_C} to ${WHAT_IF_MAX_SHIFT_C}` })
  @IsOptional() @IsNumber({ allowNaN: false, allowInfinity: false }, { message: 'shift must be a number of °C' })
  @Min(-WHAT_IF_MAX_SHIFT_C, { message: `shift must be between −${WHAT_IF_MAX_SHIFT_C} and ${WHAT_IF_MAX_SHIFT_C} °C` })
  @Max(WHAT_IF_MAX_SHIFT_C, { message: `shift must be between −${WHAT_IF_MAX_SHIFT_C} and ${WHAT_IF_MAX_SHIFT_C} °C` })
  shift?: number;

  @ApiPropertyOptional({ description: 'issue time of a temperature forecast vintage known for the day (ISO 8601 with offset)' })
  @IsOptional() @IsString() @MaxLength(40)
  vintage?: string;

  @ApiProperty()
  @Transform(trim) @IsString() @MinLength(3, { message: 'give a reason for following the what-if (at least 3 characters)' }) @MaxLength(2000)
  reason!: string;
}
