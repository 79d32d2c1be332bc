import { Injectable } from '@nestjs/common';
import { HOUR_MS } from '@morrowline/shared';
import { WeekEarlierLoadLookup, type ForecastLookup } from '../alerts/forecast-lookup';
import { ReadingsRepository } from '../readings/readings.repository';
import { ForecastsService } from './forecasts.service';

/**
 * What the deviation alerts compare against: the latest stored forecast run of the zone for the
 * hours it covers, the load of the same hour a week earlier for the others.
 */
@Injectable()
export class StoredForecastLookup implements ForecastLookup {
  private readonly weekEarlier: WeekEarlierLoadLookup;

  constructor(
    private readonly forecasts: ForecastsService,
    readings: ReadingsRepository,
  ) {
    this.weekEarlier = new WeekEarlierLoadLookup(readings);
  }

  async forecast(zoneId: number, from: number, to: number): Promise<(number | null)[]> {
    const out = await this.weekEarlier.forecast(zoneId, from, to);
    const run = await this.forecasts.latestRun(zoneId);
    if (!run) return out;
    const first = run.firstHour.getTime();
    for (let i = 0; i < out.length; i++) {
      const k = (from + i * HOUR_MS - first) / HOUR_MS;
      if (k >= 0 && k < run.mean.length && Number.isFinite(run.mean[k])) out[i] = run.mean[k];
    }
    return out;
  }
}
