import { WEEK_HOURS } from '@morrowline/shared';
import { emptyForecastLine, type ForecastLine } from './forecast-line';

/** How many weeks of past errors the bands are drawn from. */
export const BAND_WEEKS = 4;
/** Fewer errors than this and the spread says too little to draw bands. */
export const MIN_ERRORS_FOR_BANDS = 24;

/** Quantile with linear interpolation between order statistics (Hyndman & Fan type 7). */
export function quantile(sorted: readonly number[], p: number): number {
  const h = (sorted.length - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.ceil(h);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

/**
 * The week-earlier line of the live chart: each hour shows the load of the same hour one week
 * earlier, the value the deviation alerts compare against where no forecast run covers the hour
 * (the chart draws it for the hours before the zone's run starts). Its 80 % and 95 % bands come
 * from the empirical spread of that rule's own errors (actual − value a week before) over the last
 * BAND_WEEKS weeks of hours before `originIndex` (the first hour without a reading yet).
 *
 * `mw` is an hourly series; the line is laid out on the same hours.
 */
export function weekEarlierLine(mw: readonly (number | null)[], originIndex: number): ForecastLine {
  const line = emptyForecastLine(mw.length);
  const errors: number[] = [];
  for (let s = Math.max(WEEK_HOURS, originIndex - BAND_WEEKS * WEEK_HOURS); s < Math.min(originIndex, mw.length); s++) {
    const actual = mw[s];
    const weekBefore = mw[s - WEEK_HOURS];
    if (actual !== null && weekBefore !== null) errors.push(actual - weekBefore);
  }
  errors.sort((a, b) => a - b);
  const bands = errors.length >= MIN_ERRORS_FOR_BANDS
    ? { l80: quantile(errors, 0.1), u80: quantile(errors, 0.9), l95: quantile(errors, 0.025), u95: quantile(errors, 0.975) }
    : null;

  for (let t = WEEK_HOURS; t < mw.length; t++) {
    const base = mw[t - WEEK_HOURS];
    if (base === null) continue;
    line.mean[t] = base;
    if (!bands) continue;
    line.lower80[t] = Math.max(0, base + bands.l80);
    line.upper80[t] = base + bands.u80;
    line.lower95[t] = Math.max(0, base + bands.l95);
    line.upper95[t] = base + bands.u95;
  }
  return line;
}
