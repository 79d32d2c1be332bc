import { Module } from '@nestjs/common';
import { OutagesController } from './outages.controller';
import { OutagesRepository } from './outages.repository';
import { OutagesService } from './outages.service';

/** Outage and bad-data windows; exports the exclusions the models and the workbench use. */
@Module({
  controllers: [OutagesController],
  providers: [OutagesService, OutagesRepository],
  exports: [OutagesService],
})
export class OutagesModule {}
