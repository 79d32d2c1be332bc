import { Module } from '@nestjs/common';
import { OutageExclusionsLookup } from './outages-exclusions.lookup';
import { OutagesController } from './outages.controller';
import { OutagesService } from './outages.service';

/** Outage and bad-data windows; exports the exclusions the models and the workbench use. */
@Module({
  controllers: [OutagesController],
  providers: [OutagesService, OutageExclusionsLookup],
  exports: [OutagesService, OutageExclusionsLookup],
})
export class OutagesModule {}
