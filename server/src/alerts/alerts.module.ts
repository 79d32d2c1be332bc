import { Module } from '@nestjs/common';
import { ReadingsModule } from '../readings/readings.module';
import { AlertsController } from './alerts.controller';
import { AlertsService } from './alerts.service';
import { FORECAST_LOOKUP, SeasonalNaiveForecastLookup } from './forecast-lookup';

@Module({
  imports: [ReadingsModule],
  controllers: [AlertsController],
  providers: [AlertsService, { provide: FORECAST_LOOKUP, useClass: SeasonalNaiveForecastLookup }],
  exports: [AlertsService, FORECAST_LOOKUP],
})
export class AlertsModule {}
