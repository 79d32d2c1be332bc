/**
 * Rolling-origin day-ahead scoring inside a history (Tashman 2000): for each of `days` days
 * starting at `testStart`, a forecast issued `lead` hours before the day starts, using only the
 * hours before its issue time, is scored on the day's 24 hours. Returns the mean daily MAPE and
 * the standardised errors (actual − forecast) / se of every scored hour, the evidence both the
 * choice of model and the calibration of its bands (./band-calibration) rest on.
 */
import { IntervalForecast } from './forecast';
import { accuracy } from './metrics';

export interface DayAheadScore {
  /** mean of the daily MAPEs (%), NaN if no day could be scored */
  mape: number;
  /** days with at least one scored hour */
  days: number;
  /** MAPE (%) of each scored day, oldest first */
  daily: number[];
  /** (actual − forecast) / se per scored hour, oldest first */
  z: number[];
  /** the test day (0 = the first) each entry of `z` belongs to, for weighting by age */
  zDay: number[];
}

/** `forecastFrom(origin, h)` forecasts h hours after y[origin − 1] from y[0..origin). */
export function scoreDayAhead(
  y: ArrayLike<number>,
  testStart: number,
  days: number,
  lead: number,
  forecastFrom: (origin: number, h: number) => IntervalForecast,
): DayAheadScore {
  let sum = 0;
  let count = 0;
  const z: number[] = [];
  const zDay: number[] = [];
  const daily: number[] = [];
  for (let d = 0; d < days; d++) {
    const ws = testStart + d * 24;
    if (ws + 24 > y.length) break;
    const f = forecastFrom(ws - lead, lead + 24);
    const mean = f.mean.slice(lead);
    const actual = Array.from({ length: 24 }, (_, i) => y[ws + i]);
    const m = accuracy(actual, { mean }).mape;
    if (Number.isFinite(m)) {
      daily.push(m);
      sum += m;
      count++;
    }
    for (let i = 0; i < 24; i++) {
      const se = f.se[lead + i];
      if (Number.isFinite(actual[i]) && se > 0) {
        z.push((actual[i] - mean[i]) / se);
        zDay.push(d);
      }
    }
  }
  return { mape: count ? sum / count : NaN, days: count, daily, z, zDay };
}
