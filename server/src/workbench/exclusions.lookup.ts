/**
 * Which hours of a zone are marked as outage or bad data, so the analysis treats them as
 * missing (bound to the outages' lookup in WorkbenchModule).
 */
export abstract class ExclusionsLookup {
  /** UTC hour starts (ms) in [from, to) excluded for the zone. */
  abstract excludedHours(zone: string, from: number, to: number): Promise<Set<number>>;
}
