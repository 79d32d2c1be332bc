import { ApiPropertyOptional, ApiProperty } from '@nestjs/swagger';
import { IsInt, Max, Min } from 'class-validator';
import { ToInteger } from '../../common/validation/to-integer';
import { IsOptional } from '../../common/validation/is-optional';
import { BACKTEST_MAX_DAYS, BACKTEST_MIN_DAYS, type BacktestRequest, WORKBENCH_MAX_WEEKS, WORKBENCH_MIN_WEEKS } from '@morrowline/shared';

/** `?weeks=8`: how many weeks of history, ending at the latest reading, to analyse. */
export class WorkbenchQueryDto {
  @ApiPropertyOptional({ minimum: WORKBENCH_MIN_WEEKS, maximum: WORKBENCH_MAX_WEEKS, default: 8 })
  @IsOptional()
  @ToInteger()
  @IsInt({ message: 'weeks must be a whole number' })
  @Min(WORKBENCH_MIN_WEEKS, { message: `weeks must be at least ${WORKBENCH_MIN_WEEKS}` })
  @Max(WORKBENCH_MAX_WEEKS, { message: `weeks must be at most ${WORKBENCH_MAX_WEEKS}` })
  weeks?: number;
}

export class BacktestRequestDto implements BacktestRequest {
  @ApiProperty({ minimum: BACKTEST_MIN_DAYS, maximum: BACKTEST_MAX_DAYS, example: 14 })
  @IsInt({ message: 'days must be a whole number' })
  @Min(BACKTEST_MIN_DAYS, { message: `days must be at least ${BACKTEST_MIN_DAYS}` })
  @Max(BACKTEST_MAX_DAYS, { message: `days must be at most ${BACKTEST_MAX_DAYS}` })
  days!: number;
}
