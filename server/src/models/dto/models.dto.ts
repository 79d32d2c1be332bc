import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsIn, IsInt, IsString, Max, MaxLength, Min, MinLength } from 'class-validator';
import { ToInteger } from '../../common/validation/to-integer';
import { IsOptional } from '../../common/validation/is-optional';
import { REFIT_JOB_STATES, type PromoteModelRequest, type RefitJobState, type StartRefitRequest } from '@morrowline/shared';
import { IsZoneCode } from '../../common/validation/is-zone-code';

export class StartRefitDto implements StartRefitRequest {
  @ApiPropertyOptional({ example: 'COPPERLINE', description: 'omit for all active zones' })
  @IsOptional() @IsZoneCode()
  zone?: string;

  @ApiProperty({ example: 'Feeder 12 outage marked; refit without it' })
  @IsString() @MinLength(1, { message: 'a reason is needed for the refit' }) @MaxLength(1000)
  reason!: string;
}

export class RefitsQueryDto {
  @ApiPropertyOptional({ enum: REFIT_JOB_STATES })
  @IsOptional() @IsIn([...REFIT_JOB_STATES], { message: `state must be one of ${REFIT_JOB_STATES.join(', ')}` })
  state?: RefitJobState;

  @IsOptional() @IsZoneCode()
  zone?: string;

  @IsOptional() @ToInteger() @IsInt() @Min(1) @Max(500)
  limit: number = 100;
}

export class ModelsQueryDto {
  @IsOptional() @IsZoneCode()
  zone?: string;

  @IsOptional() @ToInteger() @IsInt() @Min(1) @Max(500)
  limit: number = 100;
}

export class PromoteModelDto implements PromoteModelRequest {
  @ApiProperty({ example: 'Lower backtest error and clean residuals after the outage' })
  @IsString() @MinLength(1, { message: 'a reason is needed to change the model in service' }) @MaxLength(1000)
  reason!: string;
}
