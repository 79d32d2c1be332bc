/**
 * The load a different temperature forecast would mean, from a stored model with weather terms.
 * A forecast of regression with ARIMA errors is the error model's forecast plus the response
 * x'β on the forecast temperature (engine/src/weather/weather-pipeline.ts); only the second
 * part reads the temperature, so the load on another temperature path is the model forecast
 * plus g(T_what-if) − g(T_forecast), with β and the thresholds held as fitted (the calendar
 * dummies cancel: the calendar is the same). Exact for the engine's model, no refit.
 */
import { responseValues, termNames, type CalendarHours, type LoadResponse } from '@morrowline/engine';
import type { WeatherWhatIfDto } from '@morrowline/shared';
import type { StoredWeather } from '../stored-model';

/** The engine's LoadResponse from what a version stores (coefficients not stored count as 0). */
export function storedResponse(w: Pick<StoredWeather, 'terms' | 'response'>): LoadResponse {
  const names = termNames(w.terms);
  const byName = new Map(w.response.map((c) => [c.name, c]));
  return {
    terms: w.terms,
    names,
    beta: Float64Array.from(names, (n) => byName.get(n)?.value ?? 0),
    se: Float64Array.from(names, (n) => byName.get(n)?.se ?? NaN),
    // a what-if moves the temperature, not the coefficients: their covariance is not read here
    covariance: { names: [], values: new Float64Array(0) },
    estimated: names.map((n) => byName.has(n)),
    rss: NaN,
    n: 0,
  };
}

/** g(what-if) − g(base) for hours [from, to) of two temperature paths on one timeline, MW. */
export function responseChange(w: Pick<StoredWeather, 'terms' | 'response'>, base: Float64Array, whatIf: Float64Array, calendar: CalendarHours, from: number, to: number): Float64Array {
  const r = storedResponse(w);
  const a = responseValues(r, base, calendar, from, to);
  const b = responseValues(r, whatIf, calendar, from, to);
  return b.map((v, i) => v - a[i]);
}

/**
 * The what-if's hours as schedule "add" adjustments: the hour's position in the operating day
 * (from the day's first hour, so 23- and 25-hour days line up with the schedule's hours) and its
 * change rounded to 0.1 MW; hours without a change, or whose change rounds to 0, are left alone.
 */
export function whatIfHours(w: Pick<WeatherWhatIfDto, 'hours'>, dayStartMs: number): Array<{ hour: number; value: number }> {
  const out: Array<{ hour: number; value: number }> = [];
  for (const h of w.hours) {
    if (h.changeMw === null) continue;
    const value = Math.round(h.changeMw * 10) / 10;
    if (value === 0) continue;
    out.push({ hour: Math.round((Date.parse(h.hourStart) - dayStartMs) / 3_600_000), value });
  }
  return out;
}
