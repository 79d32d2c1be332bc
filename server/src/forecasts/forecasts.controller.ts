import { Controller, Get, Param, Query } from '@nestjs/common';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import type { ForecastDiffDto, ForecastRunSummaryDto, LatestForecastsDto } from '@morrowline/shared';
import { SignedIn } from '../common/decorators/roles.decorator';
import { ForecastDiffQueryDto, ForecastRunsQueryDto, LatestForecastsQueryDto } from './dto/forecasts.dto';
import { ForecastsService } from './forecasts.service';

@ApiTags('forecasts')
@ApiBearerAuth()
@Controller('forecasts')
export class ForecastsController {
  constructor(private readonly forecasts: ForecastsService) {}

  @Get('latest')
  @SignedIn()
  latest(@Query() query: LatestForecastsQueryDto): Promise<LatestForecastsDto> {
    return this.forecasts.latest(query.zone, query.from, query.to);
  }

  /** The zone's stored runs with their issue times, newest first. */
  @Get('runs')
  @SignedIn()
  runs(@Query() query: ForecastRunsQueryDto): Promise<ForecastRunSummaryDto[]> {
    return this.forecasts.runs(query.zone, query.limit);
  }

  /** How the forecast moved from run :id to run `against`, hour by hour. */
  @Get('runs/:id/diff')
  @SignedIn()
  diff(@Param('id', ParseIdPipe) id: number, @Query() query: ForecastDiffQueryDto): Promise<ForecastDiffDto> {
    return this.forecasts.diff(id, query.against, query.from, query.to);
  }
}
