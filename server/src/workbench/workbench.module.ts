import { Module } from '@nestjs/common';
import { ComputeModule } from '../compute/compute.module';
import { OutageExclusionsLookup } from '../outages/outages-exclusions.lookup';
import { OutagesModule } from '../outages/outages.module';
import { ReadingsModule } from '../readings/readings.module';
import { ZonesModule } from '../zones/zones.module';
import { ExclusionsLookup } from './exclusions.lookup';
import { WorkbenchController } from './workbench.controller';
import { WorkbenchService } from './workbench.service';

@Module({
  imports: [ComputeModule, ReadingsModule, ZonesModule, OutagesModule],
  controllers: [WorkbenchController],
  providers: [WorkbenchService, { provide: ExclusionsLookup, useExisting: OutageExclusionsLookup }],
})
export class WorkbenchModule {}
