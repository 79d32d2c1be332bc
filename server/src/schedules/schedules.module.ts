import { Module } from '@nestjs/common';
import { ForecastsModule } from '../forecasts/forecasts.module';
import { ZonesModule } from '../zones/zones.module';
import { ScheduleMailer } from './schedule-mailer';
import { ScheduleNotifier } from './schedule-notifier';
import { ScheduleRevisionsRepository } from './schedule-revisions.repository';
import { ScheduleSubscribersService } from './schedule-subscribers.service';
import { SchedulesController } from './schedules.controller';
import { SchedulesService } from './schedules.service';

/** Day-ahead schedules: drafts, adjustments, submission, approval and publication, exports, e-mail. */
@Module({
  imports: [ForecastsModule, ZonesModule],
  controllers: [SchedulesController],
  providers: [SchedulesService, ScheduleRevisionsRepository, ScheduleSubscribersService, ScheduleNotifier, ScheduleMailer],
  exports: [SchedulesService, ScheduleRevisionsRepository],
})
export class SchedulesModule {}
