import { Module } from '@nestjs/common';
import { OutagesModule } from '../outages/outages.module';
import { ReadingsModule } from '../readings/readings.module';
import { ZoneHistoryLoader } from './zone-history.loader';

/** A zone's hourly history with its outage hours taken out, for the refits and the workbench. */
@Module({ imports: [ReadingsModule, OutagesModule], providers: [ZoneHistoryLoader], exports: [ZoneHistoryLoader] })
export class ZoneHistoryModule {}
