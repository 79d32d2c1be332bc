import { Module } from '@nestjs/common';
import { ForecastsModule } from '../forecasts/forecasts.module';
import { ScheduleMailer } from './schedule-mailer';
import { ScheduleNotifier } from './schedule-notifier';
import { ScheduleSubscribersService } from './schedule-subscribers.service';
import { SchedulesController } from './schedules.controller';
import { SchedulesService } from './schedules.service';

/** Day-ahead schedules: drafts, adjustments, submission, approval and publication, exports, e-mail. */
@Module({
  imports: [ForecastsModule],
  controllers: [SchedulesController],
  providers: [SchedulesService, ScheduleSubscribersService, ScheduleNotifier, ScheduleMailer],
  exports: [SchedulesService],
})
export class SchedulesModule {}
