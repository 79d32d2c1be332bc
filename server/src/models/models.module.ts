import { Module } from '@nestjs/common';
import { ComputeModule } from '../compute/compute.module';
import { ForecastsModule } from '../forecasts/forecasts.module';
import { ZoneHistoryModule } from '../history/zone-history.module';
import { ReadingsModule } from '../readings/readings.module';
import { ModelsController } from './models.controller';
import { ModelsService } from './models.service';
import { RefitScheduler } from './refit-scheduler';
import { RefitsService } from './refits.service';

/** Refit jobs (scheduled and on demand, in the compute pool) and model versions. */
@Module({
  imports: [ComputeModule, ReadingsModule, ZoneHistoryModule, ForecastsModule],
  controllers: [ModelsController],
  providers: [ModelsService, RefitsService, RefitScheduler],
  exports: [RefitsService, ModelsService],
})
export class ModelsModule {}
