import { DEMO_STATIONS, HOUR_MS } from '@morrowline/shared';
import { Random, subSeed } from './random';
import type { StationWeather } from './weather';

/**
 * Temperature forecasts as a weather service issues them: twice a day (04:30 and 16:30 UTC, a few
 * hours after the 00 and 12 UTC model runs; common practice), each covering the next 168 hours.
 *
 * Error figures (from memory of published verification of 2 m temperature forecasts, not a
 * measured source): the mean absolute error is about 1–1.5 °C at day 1 and grows roughly linearly
 * by about 0.4 °C a day. Here each value errs by σ(L)·z, σ(L) = 1.0 + 0.5·L/24 °C at lead L hours,
 * so MAE = σ·√(2/π) ≈ 0.8σ: 1.2 °C at a lead of 24 hours, 2.0 at 72, 3.6 at 168. Averaged over
 * each lead day (measured in weather.spec.ts over a year): 1.0 °C for hours 1–24, 1.4 for 25–48
 * (the next operating day of a forecast made before gate closure), 1.8 day 3, 2.6 day 5, 3.5 day 7. z is a unit-variance AR(1) over the lead hours (φ = 0.97 an hour), so one
 * forecast misses over many hours together, as a front that comes early or late does, instead of
 * hour-by-hour noise. Each station's forecast errs on its own.
 *
 * Now and then a forecast is late (5 %, issued 1 to 4 hours after its usual time) or missed (3 %).
 */
export const ISSUE_MINUTES_UTC = [4 * 60 + 30, 16 * 60 + 30];
export const FORECAST_HOURS = 168;
export const ERROR_PHI = 0.97;

/** Standard deviation of the forecast error at a lead of `leadHours`, °C. */
export function errorSigma(leadHours: number): number {
  return 1.0 + (0.5 * leadHours) / 24;
}

export interface ForecastMishaps {
  late: number;
  missed: number;
}

export const DEFAULT_FORECAST_MISHAPS: ForecastMishaps = { late: 0.05, missed: 0.03 };

export interface SimForecastValue {
  station: string;
  issuedAt: string;
  hour: string;
  tempC: number;
}

export interface SimForecast {
  /** When it was issued (ms); it is sent at the end of the hour it falls in. */
  issuedAt: number;
  values: SimForecastValue[];
}

/**
 * Issues the forecasts whose usual issue time falls in each hour, deterministically for a seed
 * (the draws happen in issue order, one stream for the mishaps and one per station for errors).
 */
export class ForecastIssuer {
  private readonly mishapRandom: Random;
  private readonly errorRandom: Map<string, Random>;

  constructor(
    seed: number,
    private readonly weather: StationWeather,
    private readonly mishaps: ForecastMishaps = DEFAULT_FORECAST_MISHAPS,
  ) {
    this.mishapRandom = new Random(subSeed(seed, 'forecast-mishaps'));
    this.errorRandom = new Map(DEMO_STATIONS.map((s) => [s.code, new Random(subSeed(seed, `forecast-${s.code}`))]));
  }

  /** Forecasts normally issued within [hour, hour + 1 h), with their actual (maybe late) issue times; missed ones left out. */
  issuedIn(hour: number): SimForecast[] {
    const out: SimForecast[] = [];
    const dayStart = Math.floor(hour / (24 * HOUR_MS)) * 24 * HOUR_MS;
    for (const minutes of ISSUE_MINUTES_UTC) {
      const usual = dayStart + minutes * 60_000;
      if (usual < hour || usual >= hour + HOUR_MS) continue;
      const r = this.mishapRandom;
      const missed = r.chance(this.mishaps.missed);
      const delayHours = r.chance(this.mishaps.late) ? r.int(1, 4) : 0;
      // The error draws happen even for a missed forecast, so one mishap does not shift every later forecast.
      const values = this.make(usual + delayHours * HOUR_MS);
      if (!missed) out.push({ issuedAt: usual + delayHours * HOUR_MS, values });
    }
    return out;
  }

  private make(issuedAt: number): SimForecastValue[] {
    const first = Math.floor(issuedAt / HOUR_MS) * HOUR_MS + HOUR_MS;
    const values: SimForecastValue[] = [];
    for (const station of DEMO_STATIONS) {
      const r = this.errorRandom.get(station.code)!;
      let z = r.normal();
      for (let i = 0; i < FORECAST_HOURS; i++) {
        const hour = first + i * HOUR_MS;
        if (i > 0) z = ERROR_PHI * z + Math.sqrt(1 - ERROR_PHI * ERROR_PHI) * r.normal();
        const lead = (hour - issuedAt) / HOUR_MS;
        const truth = this.weather.at(hour).get(station.code)!;
        values.push({ station: station.code, issuedAt: new Date(issuedAt).toISOString(), hour: new Date(hour).toISOString(), tempC: Math.round((truth + errorSigma(lead) * z) * 10) / 10 });
      }
    }
    return values;
  }
}
