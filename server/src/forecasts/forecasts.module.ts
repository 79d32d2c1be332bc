import { Module } from '@nestjs/common';
import { OutagesModule } from '../outages/outages.module';
import { ReadingsModule } from '../readings/readings.module';
import { ZonesModule } from '../zones/zones.module';
import { ForecastRunsRepository } from './forecast-runs.repository';
import { ForecastsController } from './forecasts.controller';
import { ForecastsService } from './forecasts.service';

/** Stored forecast runs and the latest per zone. */
@Module({
  imports: [ReadingsModule, OutagesModule, ZonesModule],
  controllers: [ForecastsController],
  providers: [ForecastsService, ForecastRunsRepository],
  exports: [ForecastsService, ForecastRunsRepository],
})
export class ForecastsModule {}
