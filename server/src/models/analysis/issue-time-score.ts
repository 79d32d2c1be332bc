/**
 * Model versions scored as they forecast (pure; runs in the compute pool). Every version is judged
 * on the same recent operating days, each day forecast at its own issue time (the zone's gate
 * closure the day before) from only the hours that had ended by then, with the version's own
 * coefficients held fixed: the forecast the version issued that day where one is stored,
 * otherwise the forecast it would have issued (only the Kalman filter runs over the hours up to
 * the cut; nothing is re-estimated). This is a rolling-origin evaluation with a fixed model
 * (Tashman 2000), so two versions with the same orders but different coefficients score
 * differently, and a version is never flattered by a refit on the days it is scored on.
 */
import { seasonalNaive } from '@morrowline/engine';
import type { StoredModel, StoredWeather } from '../stored-model';
import { forecastStored, type RefitWeather } from './refit';

/** One operating day to score, as indices into the history. */
export interface ScoredDay {
  /** index of the day's first hour */
  dayStart: number;
  /** 23, 24 or 25 */
  hours: number;
  /** hours of history that had ended at the issue time: indices below `cut` only */
  cut: number;
  /** the issue time, hours from the start of hour 0 (what a version with weather terms may know of the temperature forecast) */
  issuedAt?: number;
}

/** A forecast a version issued for one day: its values over the day's hours, in order. */
export interface IssuedDay {
  mean: number[];
  lower80: number[];
  upper80: number[];
}

export interface VersionToScore {
  model: StoredModel;
  /** per scored day, the forecast the version issued for it, or null to re-forecast */
  issued: (IssuedDay | null)[];
  /** its weather terms, when it has them: re-forecasts then use the temperature forecast known at each day's issue time */
  weather?: StoredWeather | null;
}

export interface IssueTimeInput {
  /** hourly MW, oldest first, NaN for missing hours */
  values: Float64Array;
  /** indices of outage and bad-data hours (never scored, never fed to a forecast) */
  excluded: number[];
  days: ScoredDay[];
  versions: VersionToScore[];
  /** the zone's weather on the history's timeline (every vintage issued by now; each day reads only those issued by its issue time) */
  weather?: RefitWeather;
}

export interface DayScore {
  /** 'issued' when the stored forecast was scored, 're-forecast' otherwise; null when it could not be forecast */
  source: 'issued' | 're-forecast' | null;
  hours: number;
  mape: number | null;
}

export interface ScoreSummary {
  /** days with a forecast that could be scored */
  days: number;
  hours: number;
  /** mean absolute percentage error over every scored hour, % */
  mape: number | null;
  /** mean error (forecast − actual), MW: positive = too high */
  bias: number | null;
  /** mean actual load over the scored hours, MW */
  level: number | null;
  /** share of scored hours inside the 80 % band, % (null when no band) */
  coverage80: number | null;
}

export interface VersionScore extends ScoreSummary {
  perDay: DayScore[];
}

export interface IssueTimeResult {
  versions: VersionScore[];
  /** the same hour one week earlier, from the history at each issue time */
  baseline: ScoreSummary;
  /** hours with an actual reading on each day (the hours every version is scored on) */
  scoredHours: number[];
}

const HORIZON_LIMIT = 14 * 24;

class Tally {
  hours = 0;
  days = 0;
  private ape = 0;
  private err = 0;
  private load = 0;
  private inside = 0;
  private banded = 0;

  add(forecast: number, actual: number, lower?: number, upper?: number): void {
    this.hours++;
    this.ape += Math.abs(forecast - actual) / Math.abs(actual);
    this.err += forecast - actual;
    this.load += actual;
    if (lower !== undefined && upper !== undefined && Number.isFinite(lower) && Number.isFinite(upper)) {
      this.banded++;
      if (actual >= lower && actual <= upper) this.inside++;
    }
  }

  summary(): ScoreSummary {
    const n = this.hours;
    return {
      days: this.days,
      hours: n,
      mape: n ? (100 * this.ape) / n : null,
      bias: n ? this.err / n : null,
      level: n ? this.load / n : null,
      coverage80: this.banded ? (100 * this.inside) / this.banded : null,
    };
  }
}

/** Which hours of each day have an actual to score against (a reading, not excluded, not zero). */
function actualHours(values: Float64Array, excluded: ReadonlySet<number>, day: ScoredDay): number[] {
  const out: number[] = [];
  for (let j = 0; j < day.hours; j++) {
    const t = day.dayStart + j;
    const y = values[t];
    if (t < values.length && Number.isFinite(y) && y !== 0 && !excluded.has(t)) out.push(j);
  }
  return out;
}

/** The version's forecast of the day made at the cut with its coefficients held; null if it cannot be made. */
function reforecast(input: IssueTimeInput, model: StoredModel, day: ScoredDay, stored?: StoredWeather | null): IssuedDay | null {
  const lead = day.dayStart - day.cut;
  const horizon = lead + day.hours;
  if (day.cut <= 0 || lead < 0 || horizon > HORIZON_LIMIT) return null;
  const values = input.values.subarray(0, day.cut);
  const excluded = input.excluded.filter((i) => i < day.cut);
  try {
    const w = input.weather;
    const at = day.issuedAt;
    const weather =
      stored?.used && w && at !== undefined
        ? { stored, inputs: { ...w, temperature: w.temperature.subarray(0, day.cut), vintages: w.vintages.filter((v) => v.issued <= at), issuedAt: at } }
        : undefined;
    const f = forecastStored({ values, excluded, horizon, model, ...(weather ? { weather } : {}) }).forecast;
    const mean = f.mean.slice(lead);
    if (!mean.every(Number.isFinite)) return null;
    return { mean, lower80: f.lower80.slice(lead), upper80: f.upper80.slice(lead) };
  } catch {
    return null;
  }
}

export function scoreAtIssueTimes(input: IssueTimeInput): IssueTimeResult {
  const excluded = new Set(input.excluded);
  const scored = input.days.map((d) => actualHours(input.values, excluded, d));
  const versions = input.versions.map((v) => {
    const tally = new Tally();
    const perDay: DayScore[] = input.days.map((day, k) => {
      const stored = v.issued[k];
      const fromStore = !!stored && stored.mean.length >= day.hours;
      const forecast = fromStore ? (stored as IssuedDay) : reforecast(input, v.model, day, v.weather);
      if (!forecast) return { source: null, hours: 0, mape: null };
      const source = fromStore ? 'issued' : 're-forecast';
      if (scored[k].length === 0) return { source, hours: 0, mape: null };
      const one = new Tally();
      for (const j of scored[k]) {
        const actual = input.values[day.dayStart + j];
        tally.add(forecast.mean[j], actual, forecast.lower80[j], forecast.upper80[j]);
        one.add(forecast.mean[j], actual);
      }
      tally.days++;
      return { source, hours: scored[k].length, mape: one.summary().mape };
    });
    return { ...tally.summary(), perDay };
  });
  const baseline = new Tally();
  input.days.forEach((day, k) => {
    if (day.cut <= 0 || scored[k].length === 0) return;
    const history = Float64Array.from(input.values.subarray(0, day.cut));
    for (const i of input.excluded) if (i < day.cut) history[i] = NaN;
    const lead = day.dayStart - day.cut;
    const f = seasonalNaive(history, lead + day.hours);
    for (const j of scored[k]) baseline.add(f.mean[lead + j], input.values[day.dayStart + j]);
    baseline.days++;
  });
  return { versions, baseline: baseline.summary(), scoredHours: scored.map((s) => s.length) };
}
