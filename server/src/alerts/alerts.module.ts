import { Module } from '@nestjs/common';
import { LiveModule } from '../live/live.module';
import { ReadingsModule } from '../readings/readings.module';
import { ZonesModule } from '../zones/zones.module';
import { AlertsController } from './alerts.controller';
import { AlertsRepository } from './alerts.repository';
import { AlertsService } from './alerts.service';

@Module({
  imports: [ReadingsModule, ZonesModule, LiveModule],
  controllers: [AlertsController],
  providers: [AlertsService, AlertsRepository],
  exports: [AlertsService],
})
export class AlertsModule {}
