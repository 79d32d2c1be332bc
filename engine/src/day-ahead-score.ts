/**
 * Rolling-origin day-ahead scoring inside a history (Tashman 2000): for each of `days` days
 * starting at `testStart`, a forecast issued `lead` hours before the day starts, using only the
 * hours before its issue time, is scored on the day's 24 hours. Returns the mean daily MAPE and
 * the standardised errors (actual − forecast) / se of every scored hour, the evidence both the
 * choice of model and the calibration of its bands (./band-calibration) rest on.
 */
import { IntervalForecast } from './forecast';
import { accuracy } from './metrics';

/**
 * Half-life (days) of the weights the candidates' day-ahead errors are ranked by (./pipeline).
 * The plain mean over four weeks let a spell the series has left decide: on Victoria's demand
 * (fixtures/vic-elec-hourly.R) the heatwaves of early February 2014 made the daily-differenced
 * model the best of the evidence, which then forecast each Monday of a mild March from the
 * Sunday before it (18.7 % on the first). Discounting older errors by a factor of about 0.95 per
 * period is the usual way to rank or weight forecasters whose relative skill drifts (Stock &
 * Watson 2004, "Combination forecasts of output growth in a seven-country data set", J.
 * Forecasting 23, 405–430; from memory): 2^(−1/14) = 0.952 a day. Measured (README, "Choosing on
 * recent evidence"): 14 against 7, 10, 21 days and equal weights, on the open demand series,
 * Victoria's four quarters of 2014 and the simulator's ten zone-seeds, issued at midnight and at
 * 09:00 the day before.
 */
export const SELECTION_HALF_LIFE_DAYS = 14;

export interface DayAheadScore {
  /** mean of the daily MAPEs (%), NaN if no day could be scored */
  mape: number;
  /**
   * the daily MAPEs' mean with weights halving every SELECTION_HALF_LIFE_DAYS back from the last
   * scored day (%), NaN if no day could be scored: what the pipeline ranks candidates by
   */
  recentMape: number;
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
  const dailyDay: number[] = [];
  for (let d = 0; d < days; d++) {
    const ws = testStart + d * 24;
    if (ws + 24 > y.length) break;
    const f = forecastFrom(ws - lead, lead + 24);
    const mean = f.mean.slice(lead);
    const actual = Array.from({ length: 24 }, (_, i) => y[ws + i]);
    const m = accuracy(actual, { mean }).mape;
    if (Number.isFinite(m)) {
      daily.push(m);
      dailyDay.push(d);
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
  return { mape: count ? sum / count : NaN, recentMape: recencyWeightedMean(daily, dailyDay, days - 1), days: count, daily, z, zDay };
}

/**
 * Mean of `xs` with weights 2^(−(lastDay − day) / halfLife), `day[i]` the test day of `xs[i]` and
 * `lastDay` the latest test day (age 0); NaN if `xs` is empty.
 */
export function recencyWeightedMean(xs: readonly number[], day: readonly number[], lastDay: number, halfLifeDays = SELECTION_HALF_LIFE_DAYS): number {
  let s = 0;
  let w = 0;
  for (let i = 0; i < xs.length; i++) {
    const wt = Math.pow(0.5, (lastDay - day[i]) / halfLifeDays);
    s += wt * xs[i];
    w += wt;
  }
  return w > 0 ? s / w : NaN;
}
