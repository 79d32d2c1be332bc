import { Injectable } from '@nestjs/common';
import { HOUR_MS } from '@morrowline/shared';
import { OutagesService } from '../outages/outages.service';
import { ReadingsService } from '../readings/readings.service';
import type { Zone } from '../zones/entities/zone.entity';

/** Hours each fit trains on: eight weeks, as the engine's backtest window. */
export const TRAINING_HOURS = 8 * 168;

export interface ZoneHistory {
  firstHourMs: number;
  lastHourMs: number;
  /** MW, NaN for missing and for excluded hours */
  values: Float64Array;
  /** indices of outage / bad-data hours */
  excluded: number[];
  usable: number;
}

/** A zone's training history from the stored readings, with its outage hours marked. */
@Injectable()
export class ZoneHistoryLoader {
  constructor(
    private readonly readings: ReadingsService,
    private readonly outages: OutagesService,
  ) {}

  /** The last `hours` hours up to the zone's latest reading; null when it has none. */
  async load(zone: Zone, hours = TRAINING_HOURS): Promise<ZoneHistory | null> {
    const last = (await this.readings.status()).find((s) => s.zone === zone.code)?.lastHour;
    if (!last) return null;
    const lastHourMs = Date.parse(last);
    const firstHourMs = lastHourMs - (hours - 1) * HOUR_MS;
    const end = lastHourMs + HOUR_MS;
    const [rows, excludedSet] = await Promise.all([this.readings.rows(zone.id, firstHourMs, end), this.outages.excludedHours(zone.code, firstHourMs, end)]);
    const values = new Float64Array(hours).fill(NaN);
    for (const row of rows) values[(row.hourStart - firstHourMs) / HOUR_MS] = row.mw;
    const excluded: number[] = [];
    for (const h of excludedSet) {
      const i = (h - firstHourMs) / HOUR_MS;
      excluded.push(i);
      values[i] = NaN;
    }
    excluded.sort((a, b) => a - b);
    let usable = 0;
    for (const v of values) if (v === v) usable++;
    return { firstHourMs, lastHourMs, values, excluded, usable };
  }
}
