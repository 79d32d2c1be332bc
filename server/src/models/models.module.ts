import { Module } from '@nestjs/common';
import { ComputeModule } from '../compute/compute.module';
import { ForecastsModule } from '../forecasts/forecasts.module';
import { ZoneHistoryModule } from '../history/zone-history.module';
import { ZonesModule } from '../zones/zones.module';
import { ReadingsModule } from '../readings/readings.module';
import { CalendarModule } from '../calendar/calendar.module';
import { WeatherModule } from '../weather/weather.module';
import { SchedulesModule } from '../schedules/schedules.module';
import { ModelsController } from './models.controller';
import { ModelVersionsRepository } from './model-versions.repository';
import { ModelsService } from './models.service';
import { RefitJobsRepository } from './refit-jobs.repository';
import { RefitScheduler } from './refit-scheduler';
import { RefitsService } from './refits.service';
import { WeatherWhatIfController } from './weather-what-if.controller';
import { WeatherWhatIfService } from './weather-what-if.service';
import { ZoneWeatherLoader } from './zone-weather.loader';

/** Refit jobs (scheduled and on demand, in the compute pool) and model versions. */
@Module({
  imports: [ComputeModule, ReadingsModule, ZoneHistoryModule, ZonesModule, ForecastsModule, WeatherModule, CalendarModule, SchedulesModule],
  controllers: [ModelsController, WeatherWhatIfController],
  providers: [ModelsService, RefitsService, RefitScheduler, ModelVersionsRepository, RefitJobsRepository, ZoneWeatherLoader, WeatherWhatIfService],
  exports: [RefitsService, ModelsService, ModelVersionsRepository, ZoneWeatherLoader],
})
export class ModelsModule {}
