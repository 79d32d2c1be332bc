/**
 * Prediction bands calibrated on past out-of-sample forecast errors.
 *
 * A model's Gaussian intervals (mean ± z·se) assume its errors are normal with the variance the
 * model implies and the same from week to week. On real load neither holds: the day-ahead errors
 * are heavier-tailed than that, and they come in spells (a run of weather the history did not
 * see makes several days in a row miss by more). Following the empirical forecast-error
 * intervals of Williams & Goodman (1971, JASA 66, 752–754), each level's half-width is set from
 * the empirical distribution of past out-of-sample errors, standardised by the model's own
 * standard error so that the growth of the error with the lead time still comes from the model
 * (the variance scaling of Hyndman & Athanasopoulos, Forecasting: Principles and Practice, 3rd
 * ed. 2021, §5.5, with the scale taken from a backtest rather than from the in-sample residuals):
 *
 *   k_c = Q^w_c(|e_t| / se_t) / z_c,   band_c = mean ± k_c · z_c · se,
 *
 * where e_t are the errors of rolling day-ahead forecasts over the last weeks (never the hours
 * the band is then scored on), z_c the normal quantile of the nominal level and Q^w_c the
 * c-quantile of the weighted empirical distribution (the inverse of the weighted ECDF: R's
 * type 1 when the weights are equal). The weights halve every HALF_LIFE_DAYS days back from the
 * forecast's issue, the exponentially weighted scale of RiskMetrics (J.P. Morgan 1996,
 * Technical Document §5.2), so that a rough spell widens the bands within days and a calm one
 * narrows them again. Each level is calibrated on its own quantile; symmetric about the mean.
 * Two constraints on the 95 % band, because its quantile, from a few weeks of hourly errors,
 * rests on a handful of independent days (day-ahead load errors move in whole-day shifts) and
 * comes out too low after a calm spell: it is never narrower than the model's own Gaussian band
 * (k95 ≥ 1), and its scale is never below the 80 % one (k95 ≥ k80: the errors' tails are at
 * least as heavy as the normal's, common practice for load). The 80 % band, whose quantile
 * rests on many more errors, follows them both ways.
 * Measured on the open demand series and the simulator's zones (README, "Bands").
 */
import { IntervalForecast, Z80, Z95 } from './forecast';

export interface BandScale {
  /** multiplier of the Gaussian 80 % half-width */
  k80: number;
  /** multiplier of the Gaussian 95 % half-width */
  k95: number;
  /** standardised out-of-sample errors the scales were estimated from (0: no calibration) */
  hours: number;
}

/** No calibration: the model's own Gaussian bands. */
export const UNSCALED: BandScale = { k80: 1, k95: 1, hours: 0 };

/** Fewer errors than four days' worth give too noisy a 95 % quantile to act on. */
export const MIN_CALIBRATION_HOURS = 96;

/** Days over which an error's weight halves. Chosen among 2, 3, 4, 5, 7 and 14 days and equal
 *  weights on the rolling backtests of the open demand series and the five simulated zones
 *  (7, 14 and 28 days each, README "Bands"); 3 missed the target ranges least. */
export const HALF_LIFE_DAYS = 3;

/** Scales are kept within these bounds: outside them the model's variance, not its tails, is wrong. */
const K_MIN = 0.25;
const K_MAX = 4;

/** Sample quantile of sorted values, R's type 7 (linear interpolation between order statistics). */
export function quantileSorted(sorted: ArrayLike<number>, p: number): number {
  const n = sorted.length;
  if (n === 0) return NaN;
  const h = (n - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, n - 1);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

/**
 * The p-quantile of a weighted sample: the smallest value whose cumulative weight reaches p of
 * the total (inverse of the weighted ECDF; with equal weights R's `quantile(x, p, type = 1)`).
 */
export function weightedQuantile(values: ArrayLike<number>, weights: ArrayLike<number>, p: number): number {
  const n = values.length;
  if (n === 0) return NaN;
  const order = Array.from({ length: n }, (_, i) => i).sort((a, b) => values[a] - values[b]);
  let total = 0;
  for (let i = 0; i < n; i++) total += weights[i];
  // a relative tolerance so that equal weights summing to exactly p·total are not missed by rounding
  const target = p * total * (1 - 1e-12);
  let cum = 0;
  for (const i of order) {
    cum += weights[i];
    if (cum >= target) return values[i];
  }
  return values[order[n - 1]];
}

/**
 * Band scales from standardised errors z = (actual − forecast) / se of past out-of-sample
 * forecasts, oldest first. `day[i]` is the test day z[i] belongs to (ascending; the last is the
 * day before the forecast is issued); without it all errors weigh the same. Non-finite values
 * (missing actuals, a zero se) are skipped.
 */
export function bandScaleFromErrors(z: ArrayLike<number>, day?: ArrayLike<number>): BandScale {
  const abs: number[] = [];
  const days: number[] = [];
  for (let i = 0; i < z.length; i++) {
    if (!Number.isFinite(z[i])) continue;
    abs.push(Math.abs(z[i]));
    days.push(day ? day[i] : 0);
  }
  if (abs.length < MIN_CALIBRATION_HOURS) return UNSCALED;
  const last = Math.max(...days);
  const w = days.map((d) => Math.pow(0.5, (last - d) / HALF_LIFE_DAYS));
  const q80 = weightedQuantile(abs, w, 0.8);
  const q95 = weightedQuantile(abs, w, 0.95);
  if (!(q95 > 0) || !(q80 > 0)) return UNSCALED;
  const k80 = clamp(q80 / Z80);
  const k95 = clamp(Math.max(q95 / Z95, k80, 1));
  return { k80, k95, hours: abs.length };
}

function clamp(k: number): number {
  return Math.min(K_MAX, Math.max(K_MIN, k));
}

/** The forecast with its 80 % and 95 % bands widened or narrowed by the scales. */
export function scaleBands(f: IntervalForecast, s: BandScale): IntervalForecast {
  const out: IntervalForecast = { mean: f.mean.slice(), se: f.se.slice(), lower80: [], upper80: [], lower95: [], upper95: [] };
  for (let i = 0; i < f.mean.length; i++) {
    const m = f.mean[i];
    const h80 = s.k80 * Z80 * f.se[i];
    const h95 = s.k95 * Z95 * f.se[i];
    out.lower80.push(m - h80);
    out.upper80.push(m + h80);
    out.lower95.push(m - h95);
    out.upper95.push(m + h95);
  }
  return out;
}
