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
 *   k_c = Q^w_{c'}(|e_t| / se_t) / z_c,   band_c = mean ± k_c · z_c · se,
 *
 * where e_t are the errors of rolling day-ahead forecasts over the last weeks (never the hours
 * the band is then scored on), z_c the normal quantile of the nominal level c and Q^w the
 * weighted empirical quantile (the inverse of the weighted ECDF: R's type 1 when the weights are
 * equal). The weights halve every HALF_LIFE_DAYS days back from the forecast's issue, the
 * exponentially weighted scale of RiskMetrics (J.P. Morgan 1996, Technical Document §5.2), so
 * that a rough spell widens the bands within days and a calm one narrows them again.
 *
 * The level c' is calibrated, not taken as c (Beran 1990, "Calibrating prediction regions",
 * JASA 85, 715–723: choose the level the rule is run at so that the coverage it achieves is the
 * nominal one). A quantile from a few weeks of hourly errors rests on a handful of independent
 * days (day-ahead errors move in whole-day shifts) and the error scale drifts from week to week,
 * so the plain c-quantile of the recent past need not cover c of the next day on average. The
 * same rule is therefore replayed over the evidence itself: each day from the eighth on is
 * covered by the weighted quantiles of the days before it only (rolling origin, Tashman 2000),
 * at every level on a grid, and c' is the lowest level whose replay covered at least c of those
 * days' hours (no lower than c − 0.1, no higher than C_MAX). The hours a band is then scored on are never among
 * them. With a steady error scale c' is c (to the grid's step); where the replay shows
 * the rule falling short after calm spells, c' rises, and where it shows it too wide, c' falls.
 *
 * The 95 % band keeps the model's own as its floor (k95 ≥ 1: its quantile rests on a few days
 * and comes out low after a calm spell), but only where the evidence does not contradict it: the
 * replay also counts the checked hours inside the model's own 95 % band, and when it covered more
 * than FLOOR_MAX_COVERAGE of them (above the 93–97 % a 95 % band is held to) the floor is dropped.
 * Held unconditionally, it kept the band of a zone whose errors are steadily smaller than its
 * model says far wider than its evidence (a 95 % band covering 99–100 %). Where the evidence is
 * too short to replay (fewer than MIN_CHECKED_DAYS days after the first week, or errors without
 * their days) the levels are the nominal ones and the floor holds. Always k95 ≥ k80: the errors'
 * tails are taken to be at least as heavy as the normal's (common practice for load).
 * Symmetric about the mean.
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

/** Days of errors before the first day the replay checks (the first quantile rests on a week). */
export const FIRST_CHECKED_DAY = 7;

/** Days the replay must check before its levels are used (otherwise nominal levels and the floor). */
export const MIN_CHECKED_DAYS = 7;

/** Levels the replay tries: LEVEL_STEP apart, from C_MIN (the nominal level less 0.1, so that a
 *  replay on a few odd days cannot empty a band) to C_MAX. */
export const LEVEL_STEP = 0.005;
const C_MAX = 0.995;
const C_MIN_BELOW_NOMINAL = 0.1;

/** Share of the replay's hours inside the model's own 95 % band above which that band is not
 *  kept as a floor: the top of the 93–97 % range a 95 % band is held to. */
export const FLOOR_MAX_COVERAGE = 0.97;

/** Days over which an error's weight halves. Chosen among 2, 3, 4, 5, 7 and 14 days and equal
 *  weights on the rolling backtests of the open demand series and the five simulated zones
 *  (7, 14 and 28 days each, README "Bands"); 3 missed the target ranges least. With the
 *  calibrated levels 2, 3 and 4 were measured again (midnight and 09:00 issue, seeds 1 and 2):
 *  3 kept the open demand series closest to its targets (2 put more of the simulated zones' figures
 *  in range, but the open demand series' last two weeks further below). */
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
 * day before the forecast is issued): recent days weigh more and the levels are calibrated by
 * replaying the rule over the days (calibratedLevels). Without `day` all errors weigh the same,
 * the levels are the nominal ones and the 95 % band keeps the model's own as its floor.
 * Non-finite values (missing actuals, a zero se) are skipped.
 */
export function bandScaleFromErrors(z: ArrayLike<number>, day?: ArrayLike<number>): BandScale {
  const { abs, days } = finiteErrors(z, day);
  if (abs.length < MIN_CALIBRATION_HOURS) return UNSCALED;
  const levels = day ? calibratedLevels(abs, days) : null;
  if (!levels) return bandScaleAtLevels(abs, days, 0.8, 0.95, true);
  return bandScaleAtLevels(abs, days, levels.p80, levels.p95, levels.modelCovered95 <= FLOOR_MAX_COVERAGE);
}

/**
 * The scales at given levels: k80 = Q^w_{p80}(|z|)/Z80, k95 = max(Q^w_{p95}(|z|)/Z95, k80), and
 * with `floorAtModel` k95 ≥ 1. `days` as in bandScaleFromErrors (all equal: equal weights).
 */
export function bandScaleAtLevels(abs: number[], days: number[], p80: number, p95: number, floorAtModel: boolean): BandScale {
  if (abs.length < MIN_CALIBRATION_HOURS) return UNSCALED;
  const last = Math.max(...days);
  const w = days.map((d) => ageWeight(last - d));
  const q80 = weightedQuantile(abs, w, p80);
  const q95 = weightedQuantile(abs, w, p95);
  if (!(q95 > 0) || !(q80 > 0)) return UNSCALED;
  const k80 = clamp(q80 / Z80);
  const k95 = clamp(Math.max(q95 / Z95, k80, floorAtModel ? 1 : 0));
  return { k80, k95, hours: abs.length };
}

export interface CalibratedLevels {
  /** level of the weighted quantile the 80 % band is set from */
  p80: number;
  /** level of the weighted quantile the 95 % band is set from */
  p95: number;
  /** days the replay checked */
  checkedDays: number;
  /** share of the checked hours the replay covered at p80 and at p95 */
  covered80: number;
  covered95: number;
  /** share of the checked hours inside the model's own 95 % band (|z| ≤ Z95) */
  modelCovered95: number;
}

/**
 * Beran's calibrated levels by a rolling replay over the evidence (see the top of this file).
 * `abs` are |z|, `days` their test days (ascending). For each day t at least FIRST_CHECKED_DAY
 * days after the first, the weighted quantiles of the days before t (weights halving every
 * HALF_LIFE_DAYS back from day t − 1) are taken at every level of the grid, and the hours of day
 * t inside each are counted. Each band's level is the lowest grid level in
 * [nominal − 0.1, C_MAX] whose replay covered at least its nominal share (C_MAX when none did).
 * Null when fewer than MIN_CHECKED_DAYS days can be checked.
 */
export function calibratedLevels(abs: ArrayLike<number>, days: ArrayLike<number>): CalibratedLevels | null {
  const n = abs.length;
  if (n === 0) return null;
  const grid: number[] = [];
  for (let i = 0; ; i++) {
    const p = Math.round((0.5 + i * LEVEL_STEP) * 1e6) / 1e6;
    if (p > C_MAX + 1e-9) break;
    grid.push(p);
  }
  const hits = new Float64Array(grid.length);
  // one sort for all checked days: each takes the errors of the days before it from this order
  const order = Array.from({ length: n }, (_, i) => i).sort((x, y) => abs[x] - abs[y]);
  let hours = 0;
  let checked = 0;
  let insideModel95 = 0;
  const first = days[0];
  // index of the first error of each day (days ascending)
  let start = 0;
  while (start < n) {
    let end = start;
    while (end < n && days[end] === days[start]) end++;
    const t = days[start];
    if (t >= first + FIRST_CHECKED_DAY && start > 0) {
      const q = weightedQuantilesBefore(abs, days, order, t, grid);
      for (let i = start; i < end; i++) {
        // q is non-decreasing in the level: the hour is covered from the first level whose quantile reaches it
        const g = lowerBound(q, abs[i]);
        for (let k = g; k < grid.length; k++) hits[k]++;
        if (abs[i] <= Z95) insideModel95++;
      }
      hours += end - start;
      checked++;
    }
    start = end;
  }
  if (checked < MIN_CHECKED_DAYS || hours === 0) return null;
  const pick = (nominal: number): { p: number; covered: number } => {
    for (let k = 0; k < grid.length; k++) {
      if (grid[k] < nominal - C_MIN_BELOW_NOMINAL - 1e-9) continue;
      if (hits[k] / hours >= nominal) return { p: grid[k], covered: hits[k] / hours };
    }
    return { p: grid[grid.length - 1], covered: hits[grid.length - 1] / hours };
  };
  const a = pick(0.8);
  const b = pick(0.95);
  return { p80: a.p, p95: b.p, checkedDays: checked, covered80: a.covered, covered95: b.covered, modelCovered95: insideModel95 / hours };
}

/**
 * Weighted quantiles at the levels `ps` (ascending) of the errors of the days before day `t`,
 * weights by age from day t − 1; `order` sorts all of `abs` ascending.
 */
function weightedQuantilesBefore(abs: ArrayLike<number>, days: ArrayLike<number>, order: number[], t: number, ps: number[]): number[] {
  const values: number[] = [];
  const cum: number[] = [];
  let total = 0;
  for (const i of order) {
    if (days[i] >= t) continue;
    total += ageWeight(t - 1 - days[i]);
    values.push(abs[i]);
    cum.push(total);
  }
  const out: number[] = [];
  let j = 0;
  for (const p of ps) {
    // the same rule as weightedQuantile: the smallest value whose cumulative weight reaches p of the total
    const target = p * total * (1 - 1e-12);
    while (j < values.length - 1 && cum[j] < target) j++;
    out.push(values[j]);
  }
  return out;
}

/** First index k with sorted[k] ≥ x (sorted.length when none). */
function lowerBound(sorted: number[], x: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (sorted[mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

function ageWeight(ageDays: number): number {
  return Math.pow(0.5, ageDays / HALF_LIFE_DAYS);
}

function finiteErrors(z: ArrayLike<number>, day?: ArrayLike<number>): { abs: number[]; days: number[] } {
  const abs: number[] = [];
  const days: number[] = [];
  for (let i = 0; i < z.length; i++) {
    if (!Number.isFinite(z[i])) continue;
    abs.push(Math.abs(z[i]));
    days.push(day ? day[i] : 0);
  }
  return { abs, days };
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
