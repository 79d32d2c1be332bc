import { Injectable } from '@nestjs/common';
import { HOUR_MS, WEEK_HOURS } from '@morrowline/shared';
import { ReadingsRepository } from '../readings/readings.repository';

/**
 * "What is the current forecast for these hours?" — what the deviation alerts compare actual load
 * against. Until model forecasts exist it is the weekly seasonal-naive value; the refit work swaps
 * the provider (`{ provide: FORECAST_LOOKUP, useClass: ... }`) without touching the alerts.
 */
export interface ForecastLookup {
  /** Forecast MW for each hour start in [from, to) of a zone; null where there is none. */
  forecast(zoneId: number, from: number, to: number): Promise<(number | null)[]>;
}

export const FORECAST_LOOKUP = Symbol('ForecastLookup');

/** Weekly seasonal naive: the forecast for an hour is the load of the same hour one week earlier. */
@Injectable()
export class SeasonalNaiveForecastLookup implements ForecastLookup {
  constructor(private readonly readings: ReadingsRepository) {}

  async forecast(zoneId: number, from: number, to: number): Promise<(number | null)[]> {
    const lag = WEEK_HOURS * HOUR_MS;
    const out = new Array<number | null>((to - from) / HOUR_MS).fill(null);
    for (const row of await this.readings.range([zoneId], from - lag, to - lag)) out[(row.hourStart + lag - from) / HOUR_MS] = row.mw;
    return out;
  }
}
