import { Injectable } from '@nestjs/common';
import { HOUR_MS, WEEK_HOURS } from '@morrowline/shared';
import { ReadingsRepository } from '../readings/readings.repository';
import { ForecastsService } from './forecasts.service';

/**
 * What the deviation alerts compare actual load against: the latest stored forecast run of the
 * zone for the hours it covers, and for the others the weekly seasonal-naive value (the load of
 * the same hour one week earlier).
 */
@Injectable()
export class StoredForecastLookup {
  constructor(
    private readonly forecasts: ForecastsService,
    private readonly readings: ReadingsRepository,
  ) {}

  /** Forecast MW for each hour start in [from, to) of a zone; null where there is none. */
  async forecast(zoneId: number, from: number, to: number): Promise<(number | null)[]> {
    const out = await this.weekEarlier(zoneId, from, to);
    const run = await this.forecasts.latestRun(zoneId);
    if (!run) return out;
    const first = run.firstHour.getTime();
    for (let i = 0; i < out.length; i++) {
      const k = (from + i * HOUR_MS - first) / HOUR_MS;
      if (k >= 0 && k < run.mean.length && Number.isFinite(run.mean[k])) out[i] = run.mean[k];
    }
    return out;
  }

  /** Weekly seasonal naive: the load of the same hour one week earlier, null where none is stored. */
  private async weekEarlier(zoneId: number, from: number, to: number): Promise<(number | null)[]> {
    const lag = WEEK_HOURS * HOUR_MS;
    const out = new Array<number | null>((to - from) / HOUR_MS).fill(null);
    for (const row of await this.readings.range([zoneId], from - lag, to - lag)) out[(row.hourStart + lag - from) / HOUR_MS] = row.mw;
    return out;
  }
}
