import { Module } from '@nestjs/common';
import { OutagesModule } from '../outages/outages.module';
import { ReadingsModule } from '../readings/readings.module';
import { ZonesModule } from '../zones/zones.module';
import { ForecastRunsRepository } from './forecast-runs.repository';
import { ForecastsController } from './forecasts.controller';
import { ForecastsService } from './forecasts.service';
import { StoredForecastLookup } from './stored-forecast.lookup';

/** Stored forecast runs, the latest per zone, and the forecast look-up of the deviation alerts. */
@Module({
  imports: [ReadingsModule, OutagesModule, ZonesModule],
  controllers: [ForecastsController],
  providers: [ForecastsService, ForecastRunsRepository, StoredForecastLookup],
  exports: [ForecastsService, ForecastRunsRepository, StoredForecastLookup],
})
export class ForecastsModule {}
