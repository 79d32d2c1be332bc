import { Module } from '@nestjs/common';
import { ForecastsModule } from '../forecasts/forecasts.module';
import { StoredForecastLookup } from '../forecasts/stored-forecast.lookup';
import { ReadingsModule } from '../readings/readings.module';
import { AlertsController } from './alerts.controller';
import { AlertsService } from './alerts.service';
import { FORECAST_LOOKUP } from './forecast-lookup';

@Module({
  imports: [ReadingsModule, ForecastsModule],
  controllers: [AlertsController],
  providers: [AlertsService, { provide: FORECAST_LOOKUP, useExisting: StoredForecastLookup }],
  exports: [AlertsService, FORECAST_LOOKUP],
})
export class AlertsModule {}
