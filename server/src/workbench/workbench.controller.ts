import { Body, Controller, Get, HttpCode, Param, Post, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { PERMISSIONS, type BacktestReportDto, type ModelReportDto, type StationarityReportDto } from '@morrowline/shared';
import { Roles } from '../common/decorators/roles.decorator';
import { BacktestRequestDto, WorkbenchQueryDto } from './dto/workbench.dto';
import { WorkbenchService } from './workbench.service';

/**
 * The analysis workbench: model internals, for operators and supervisors only (README's role
 * table); a backtest occupies the compute pool for seconds.
 */
@ApiTags('workbench')
@ApiBearerAuth()
@Controller('workbench')
export class WorkbenchController {
  constructor(private readonly workbench: WorkbenchService) {}

  /** Is the zone's load stationary, and which differencing makes it so? */
  @Get(':zone/stationarity')
  @Roles(...PERMISSIONS.readDeskWork)
  stationarity(@Param('zone') zone: string, @Query() query: WorkbenchQueryDto): Promise<StationarityReportDto> {
    return this.workbench.stationarity(zone, query.weeks);
  }

  /** The model the automatic pipeline chooses on the zone's history, with its checks. */
  @Get(':zone/model')
  @Roles(...PERMISSIONS.readDeskWork)
  model(@Param('zone') zone: string, @Query() query: WorkbenchQueryDto): Promise<ModelReportDto> {
    return this.workbench.model(zone, query.weeks);
  }

  /** Rolling day-ahead backtest over the last `days` operating days against seasonal naive. */
  @Post(':zone/backtest')
  @HttpCode(200)
  @Roles(...PERMISSIONS.forecast)
  backtest(@Param('zone') zone: string, @Body() body: BacktestRequestDto): Promise<BacktestReportDto> {
    return this.workbench.backtest(zone, body.days);
  }
}
