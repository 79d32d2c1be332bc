import { Injectable } from '@nestjs/common';
import { ExclusionsLookup } from '../workbench/exclusions.lookup';
import { OutagesService } from './outages.service';

/** The workbench's ExclusionsLookup backed by the stored outage and bad-data windows. */
@Injectable()
export class OutageExclusionsLookup extends ExclusionsLookup {
  constructor(private readonly outages: OutagesService) {
    super();
  }

  excludedHours(zone: string, from: number, to: number): Promise<Set<number>> {
    return this.outages.excludedHours(zone, from, to);
  }
}
