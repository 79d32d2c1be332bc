import { Module } from '@nestjs/common';
import { ZonesModule } from '../zones/zones.module';
import { CalendarController } from './calendar.controller';
import { CalendarService } from './calendar.service';
import { SpecialDaysRepository } from './special-days.repository';

@Module({
  imports: [ZonesModule],
  controllers: [CalendarController],
  providers: [CalendarService, SpecialDaysRepository],
  exports: [CalendarService],
})
export class CalendarModule {}
