import { Module } from '@nestjs/common';
import { ComputeModule } from '../compute/compute.module';
import { ForecastsModule } from '../forecasts/forecasts.module';
import { OutagesModule } from '../outages/outages.module';
import { ReadingsModule } from '../readings/readings.module';
import { SchedulesModule } from '../schedules/schedules.module';
import { DemoReplayService } from './demo-replay.service';
import { DemoSchedulesService } from './demo-schedules.service';
import { ForecastReplayService } from './forecast-replay.service';

/** The first start's replay of the desk's daily work and the demo scenario's schedules (no routes). */
@Module({
  imports: [ComputeModule, ReadingsModule, OutagesModule, ForecastsModule, SchedulesModule],
  providers: [ForecastReplayService, DemoSchedulesService, DemoReplayService],
  exports: [DemoReplayService],
})
export class ReplayModule {}
