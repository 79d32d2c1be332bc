import { Module } from '@nestjs/common';
import { ComputeModule } from '../compute/compute.module';
import { ReadingsModule } from '../readings/readings.module';
import { ZonesModule } from '../zones/zones.module';
import { ExclusionsLookup, NoExclusionsLookup } from './exclusions.lookup';
import { WorkbenchController } from './workbench.controller';
import { WorkbenchService } from './workbench.service';

@Module({
  imports: [ComputeModule, ReadingsModule, ZonesModule],
  controllers: [WorkbenchController],
  providers: [WorkbenchService, { provide: ExclusionsLookup, useClass: NoExclusionsLookup }],
})
export class WorkbenchModule {}
