import { Module } from '@nestjs/common';
import { ScheduleInForce } from '../accuracy/schedule-in-force';
import { ForecastsModule } from '../forecasts/forecasts.module';
import { SchedulesModule } from '../schedules/schedules.module';
import { ZonesModule } from '../zones/zones.module';
import { CommittedLoadService } from './committed-load.service';
import { LiveController } from './live.controller';

/** The live view's server side: what each zone committed to, hour by hour (no tables of its own). */
@Module({
  imports: [ZonesModule, ForecastsModule, SchedulesModule],
  controllers: [LiveController],
  providers: [CommittedLoadService, ScheduleInForce],
  exports: [CommittedLoadService],
})
export class LiveModule {}
