import { Module } from '@nestjs/common';
import { ComputeModule } from '../compute/compute.module';
import { ZoneHistoryModule } from '../history/zone-history.module';
import { ModelsModule } from '../models/models.module';
import { ZonesModule } from '../zones/zones.module';
import { WorkbenchController } from './workbench.controller';
import { WorkbenchService } from './workbench.service';

@Module({
  imports: [ComputeModule, ZoneHistoryModule, ZonesModule, ModelsModule],
  controllers: [WorkbenchController],
  providers: [WorkbenchService],
})
export class WorkbenchModule {}
