import { Module } from '@nestjs/common';
import { ComputeModule } from '../compute/compute.module';
import { ForecastsModule } from '../forecasts/forecasts.module';
import { OutagesModule } from '../outages/outages.module';
import { ReadingsModule } from '../readings/readings.module';
import { ModelsController } from './models.controller';
import { ModelsService } from './models.service';
import { RefitsService } from './refits.service';
import { ZoneHistoryLoader } from './zone-history';

/** Refit jobs (scheduled and on demand, in the compute pool) and model versions. */
@Module({
  imports: [ComputeModule, ReadingsModule, OutagesModule, ForecastsModule],
  controllers: [ModelsController],
  providers: [ModelsService, RefitsService, ZoneHistoryLoader],
  exports: [RefitsService, ModelsService],
})
export class ModelsModule {}
