import { Injectable } from '@nestjs/common';
import { HOUR_MS } from '@morrowline/shared';
import { SeasonalNaiveForecastLookup, type ForecastLookup } from '../alerts/forecast-lookup';
import { ReadingsRepository } from '../readings/readings.repository';
import { ForecastsService } from './forecasts.service';

/**
 * What the deviation alerts compare against: the latest stored forecast run of the zone for the
 * hours it covers, the weekly seasonal-naive value for the others.
 */
@Injectable()
export class StoredForecastLookup implements ForecastLookup {
  private readonly naive: SeasonalNaiveForecastLookup;

  constructor(
    private readonly forecasts: ForecastsService,
    readings: ReadingsRepository,
  ) {
    this.naive = new SeasonalNaiveForecastLookup(readings);
  }

  async forecast(zoneId: number, from: number, to: number): Promise<(number | null)[]> {
    const out = await this.naive.forecast(zoneId, from, to);
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
