import { Controller, Get, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import type { LatestForecastsDto } from '@morrowline/shared';
import { SignedIn } from '../common/decorators/roles.decorator';
import { LatestForecastsQueryDto } from './dto/forecasts.dto';
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
}
