import { Injectable } from '@nestjs/common';
import { HOUR_MS } from '@morrowline/shared';
import { OutagesService } from '../outages/outages.service';
import { ReadingsRepository } from '../readings/readings.repository';
import type { Zone } from '../zones/entities/zone.entity';
import { TRAINING_HOURS, zoneHistoryWindow, type ZoneHistory } from './zone-history';

export { TRAINING_HOURS, type ZoneHistory } from './zone-history';

/**
 * A zone's hourly history from the stored readings, with its outage hours marked and taken out:
 * the one loader the refits, the model comparison and the analysis workbench read.
 */
@Injectable()
export class ZoneHistoryLoader {
  constructor(
    private readonly readings: ReadingsRepository,
    private readonly outages: OutagesService,
  ) {}

  /**
   * The zone's latest stored hour (its own query, not every zone's); null when it has none. An
   * inactive zone counts as having none, as in the feed status: it is not analysed or refitted.
   */
  async lastHour(zone: Zone): Promise<number | null> {
    if (!zone.active) return null;
    return this.readings.lastHour(zone.id);
  }

  /** The last `hours` hours up to the zone's latest reading; null when it has none. */
  async load(zone: Zone, hours = TRAINING_HOURS): Promise<ZoneHistory | null> {
    const lastHourMs = await this.lastHour(zone);
    if (lastHourMs === null) return null;
    return this.ending(zone, lastHourMs, hours);
  }

  /** The `hours` hours ending with the hour that starts at `lastHourMs`. */
  async ending(zone: Zone, lastHourMs: number, hours: number): Promise<ZoneHistory> {
    const firstHourMs = lastHourMs - (hours - 1) * HOUR_MS;
    const end = lastHourMs + HOUR_MS;
    const [rows, excluded] = await Promise.all([this.readings.range([zone.id], firstHourMs, end), this.outages.excludedHours(zone.code, firstHourMs, end)]);
    return zoneHistoryWindow(lastHourMs, hours, rows, excluded);
  }
}
