import { Module } from '@nestjs/common';
import { OutagesController } from './outages.controller';
import { OutagesService } from './outages.service';

/** Outage and bad-data windows; exports the exclusions the models and the workbench use. */
@Module({
  controllers: [OutagesController],
  providers: [OutagesService],
  exports: [OutagesService],
})
export class OutagesModule {}
