import { Injectable } from '@nestjs/common';
import { HOUR_MS, WEEK_HOURS } from '@morrowline/shared';
import { ReadingsRepository } from '../readings/readings.repository';

/**
 * "What is the current forecast for these hours?" — what the deviation alerts compare actual load
 * against. AlertsModule binds it to StoredForecastLookup (forecasts/): the zone's latest stored
 * run where it covers the hour, the load a week earlier elsewhere.
 */
export interface ForecastLookup {
  /** Forecast MW for each hour start in [from, to) of a zone; null where there is none. */
  forecast(zoneId: number, from: number, to: number): Promise<(number | null)[]>;
}

export const FORECAST_LOOKUP = Symbol('ForecastLookup');

/** The load of the same hour one week earlier, from the stored readings (null where there is none). */
@Injectable()
export class WeekEarlierLoadLookup implements ForecastLookup {
  constructor(private readonly readings: ReadingsRepository) {}

  async forecast(zoneId: number, from: number, to: number): Promise<(number | null)[]> {
    const lag = WEEK_HOURS * HOUR_MS;
    const out = new Array<number | null>((to - from) / HOUR_MS).fill(null);
    for (const row of await this.readings.range([zoneId], from - lag, to - lag)) out[(row.hourStart + lag - from) / HOUR_MS] = row.mw;
    return out;
  }
}
