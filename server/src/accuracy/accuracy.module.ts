import { Module } from '@nestjs/common';
import { ForecastsModule } from '../forecasts/forecasts.module';
import { OutagesModule } from '../outages/outages.module';
import { ReadingsModule } from '../readings/readings.module';
import { SchedulesModule } from '../schedules/schedules.module';
import { WeatherModule } from '../weather/weather.module';
import { ZonesModule } from '../zones/zones.module';
import { AccuracyController } from './accuracy.controller';
import { AccuracyService } from './accuracy.service';
import { ScheduleInForce } from './schedule-in-force';

/** Accuracy of the model forecast and the published schedule against actuals (no tables). */
@Module({
  imports: [ReadingsModule, OutagesModule, ZonesModule, ForecastsModule, SchedulesModule, WeatherModule],
  controllers: [AccuracyController],
  providers: [AccuracyService, ScheduleInForce],
})
export class AccuracyModule {}
