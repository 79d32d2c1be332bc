import { Module } from '@nestjs/common';
import { OutagesModule } from '../outages/outages.module';
import { ReadingsModule } from '../readings/readings.module';
import { ForecastsController } from './forecasts.controller';
import { ForecastsService } from './forecasts.service';
import { StoredForecastLookup } from './stored-forecast.lookup';

/** Stored forecast runs, the latest per zone, and the forecast look-up of the deviation alerts. */
@Module({
  imports: [ReadingsModule, OutagesModule],
  controllers: [ForecastsController],
  providers: [ForecastsService, StoredForecastLookup],
  exports: [ForecastsService, StoredForecastLookup],
})
export class ForecastsModule {}
