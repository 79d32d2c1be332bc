import { Injectable } from '@nestjs/common';

/**
 * Which hours of a zone are marked as outage or bad data, so the analysis treats them as
 * missing. The outage work will provide the real lookup (bind it in place of
 * `NoExclusionsLookup` in WorkbenchModule); until then nothing is excluded.
 */
export abstract class ExclusionsLookup {
  /** UTC hour starts (ms) in [from, to) excluded for the zone. */
  abstract excludedHours(zone: string, from: number, to: number): Promise<Set<number>>;
}

@Injectable()
export class NoExclusionsLookup extends ExclusionsLookup {
  excludedHours(): Promise<Set<number>> {
    return Promise.resolve(new Set());
  }
}
