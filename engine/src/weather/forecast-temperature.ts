/**
 * The temperature a forecast issued at time `at` works with, and how uncertain it is, from what
 * was known then only (./vintages):
 *  - hours that ended by `at` keep their observed temperature (no uncertainty);
 *  - later hours take the latest COMBINED_VINTAGES vintages issued at or before `at`, each
 *    corrected by its own error so far and combined by inverse-variance weights (below,
 *    combineVintages); when the latest vintage is an ensemble, it alone (corrected), its member
 *    mean, and each member's path for the spread; where nothing combines, the latest vintage
 *    that covers the hour;
 *  - hours no known vintage covers take the observed temperature 24 hours (48, …) earlier
 *    (persistence), with the error of that rule measured on the history.
 * The standard error of a forecast temperature at lead L hours is the root mean square error of
 * the vintages known at `at` against the temperature observed later, at leads in the same
 * 12-hour bin (the measured error of past forecasts by lead time: Hyndman & Athanasopoulos,
 * Forecasting: Principles and Practice, 3rd ed. 2021, §7.6, on forecasting with predictors that
 * must be forecast themselves; the error grows with the lead, so one figure for all leads would
 * be too wide for the first day and too narrow for the second). Bins with fewer than 24 errors
 * take the nearest shorter-lead bin that has them, scaled up by the ratio of the leads (errors
 * grow about linearly with the lead; common practice); with no measured error at all the
 * persistence error stands in.
 *
 * A vintage's own error so far. By the issue time a vintage has already been wrong
 * for some hours (it was issued hours earlier, and those hours have been observed), and a
 * temperature forecast's errors persist over many hours (a front early or late). So its forecast
 * for the hours ahead is corrected by its recent error: with e₀ its mean error over the last
 * three observed hours and g the hours from the last observed one, the correction is b_g·e₀,
 * b_g the least-squares slope (no intercept) of the error g hours later on e₀ over the past
 * vintages at the same age (each taken at as many hours after its issue as this one is now), and the standard error of the corrected value is the root mean square of those
 * regressions' residuals. Where the errors do not persist b_g is near 0 and nothing changes.
 * This is the measured-error approach above made conditional on what has been observed
 * (regression on the current error is a common practice of updating a forecast with
 * observations, as in model output statistics: Glahn & Lowry 1972, J. Appl. Meteor. 11,
 * 1203–1211).
 */
import { knownVintages, TemperatureVintage, vintageMean } from './vintages';

export const LEAD_BIN_HOURS = 12;
/** the latest vintages combined (combineVintages): three days of a twice-daily service */
export const COMBINED_VINTAGES = 6;
/** hours of the vintage's latest errors averaged into e₀ */
export const RECENT_ERROR_HOURS = 3;
/** past vintages needed for a slope b_g */
const MIN_PAST_VINTAGES = 10;
const MIN_ERRORS_PER_BIN = 24;
/** the smallest standard error a combined vintage is given, °C: the resolution forecasts are sent in (0.1 °C) */
const MIN_VINTAGE_SD = 0.03;

export interface ForecastTemperature {
  /** temperature path over hours 0..at+h: observed before `at`, forecast after (NaN where nothing is known) */
  path: Float64Array;
  /** the member paths over the same hours (one per member of the vintage used; empty without members) */
  members: Float64Array[];
  /** standard error of each forecast hour's temperature (steps 0..h−1 from the first hour at or after `at`), °C */
  sd: Float64Array;
  /** issue time of the vintage used for the first forecast hour (NaN: none, persistence) */
  vintageIssued: number;
}

/**
 * Root mean square error of known vintages by lead bin, measured on the hours observed by `at`.
 * Returns one value per bin (index floor(lead / 12)), NaN where too few errors.
 */
export function leadErrors(observed: ArrayLike<number>, vintages: readonly TemperatureVintage[], at: number, bins = 15): Float64Array {
  const ss = new Float64Array(bins);
  const cnt = new Float64Array(bins);
  const lastObserved = Math.min(observed.length, Math.floor(at));
  for (const v of knownVintages(vintages, at)) {
    const end = Math.min(lastObserved, v.first + v.members[0].length);
    for (let i = Math.max(0, v.first); i < end; i++) {
      const o = observed[i];
      const f = vintageMean(v, i);
      if (!Number.isFinite(o) || !Number.isFinite(f)) continue;
      const b = Math.floor(Math.max(0, i - v.issued) / LEAD_BIN_HOURS);
      if (b >= bins) continue;
      ss[b] += (o - f) * (o - f);
      cnt[b]++;
    }
  }
  const out = new Float64Array(bins).fill(NaN);
  for (let b = 0; b < bins; b++) if (cnt[b] >= MIN_ERRORS_PER_BIN) out[b] = Math.sqrt(ss[b] / cnt[b]);
  return out;
}

/** Root mean square of T_t − T_{t−24} over the observed hours before `at`: the persistence rule's error. */
export function persistenceError(observed: ArrayLike<number>, at: number): number {
  let s = 0;
  let k = 0;
  for (let t = 24; t < Math.min(observed.length, Math.floor(at)); t++) {
    const d = observed[t] - observed[t - 24];
    if (Number.isFinite(d)) {
      s += d * d;
      k++;
    }
  }
  return k ? Math.sqrt(s / k) : NaN;
}

function sdAtLead(byBin: Float64Array, lead: number, fallback: number): number {
  const b = Math.min(byBin.length - 1, Math.floor(Math.max(0, lead) / LEAD_BIN_HOURS));
  if (Number.isFinite(byBin[b])) return byBin[b];
  for (let c = b - 1; c >= 0; c--) if (Number.isFinite(byBin[c])) return byBin[c] * ((b + 0.5) / (c + 0.5));
  for (let c = b + 1; c < byBin.length; c++) if (Number.isFinite(byBin[c])) return byBin[c];
  return fallback;
}

/**
 * The temperature path and its uncertainty for a forecast issued at `at` (an hour index: hours
 * before it are observed) covering h hours from `at`. `observed` may be longer than `at`: later
 * values are never read. `vintagesAt` (default `at`) is the issue time when it is later than the
 * last observed hour: vintages issued up to it are used.
 */
export function forecastTemperature(observed: ArrayLike<number>, vintages: readonly TemperatureVintage[], at: number, h: number, vintagesAt = at): ForecastTemperature {
  const o = Math.floor(at);
  const path = new Float64Array(o + h).fill(NaN);
  for (let i = 0; i < Math.min(o, observed.length); i++) path[i] = observed[i];
  const known = knownVintages(vintages, vintagesAt);
  const latest = known.length ? known[known.length - 1] : undefined;
  const byBin = leadErrors(observed, vintages, at);
  const persistence = persistenceError(observed, at);
  const sd = new Float64Array(h);
  // an ensemble's members carry its own spread: its latest vintage alone, corrected; otherwise the combination
  const ensemble = !!latest && latest.members.length > 1;
  const combined = latest && !ensemble ? combineVintages(observed, known, at, h, byBin, persistence) : null;
  const update = ensemble ? recentErrorUpdate(observed, known, latest, at, h) : null;
  for (let j = 0; j < h; j++) {
    const i = o + j;
    let v = NaN;
    let used: TemperatureVintage | undefined;
    for (let k = known.length - 1; k >= 0 && !Number.isFinite(v); k--) {
      v = vintageMean(known[k], i);
      if (Number.isFinite(v)) used = known[k];
    }
    if (used) {
      path[i] = v;
      sd[j] = sdAtLead(byBin, i - used.issued, persistence);
      const c = combined ? combined.value[j] : NaN;
      if (combined && Number.isFinite(c)) {
        path[i] = c;
        sd[j] = combined.sd[j];
      } else if (used === latest && update && Number.isFinite(update.shift[j])) {
        path[i] = v + update.shift[j];
        sd[j] = update.sd[j];
      }
    } else {
      for (let u = i - 24; u >= 0 && !Number.isFinite(v); u -= 24) if (u < o) v = path[u];
      path[i] = v;
      sd[j] = Number.isFinite(persistence) ? persistence : 0;
    }
  }
  const members: Float64Array[] = [];
  if (latest && ensemble) {
    for (const m of latest.members) {
      const p = Float64Array.from(path);
      for (let j = 0; j < h; j++) {
        const k = o + j - latest.first;
        if (k >= 0 && k < m.length && Number.isFinite(m[k])) p[o + j] = m[k] + (update && Number.isFinite(update.shift[j]) ? update.shift[j] : 0);
      }
      members.push(p);
    }
  }
  return { path, members, sd, vintageIssued: latest ? latest.issued : NaN };
}

/** The path for "perfect weather": the observed temperature of the forecast hours too, no uncertainty. */
export function observedTemperature(observed: ArrayLike<number>, at: number, h: number): ForecastTemperature {
  const o = Math.floor(at);
  const path = new Float64Array(o + h).fill(NaN);
  for (let i = 0; i < Math.min(o + h, observed.length); i++) path[i] = observed[i];
  return { path, members: [], sd: new Float64Array(h), vintageIssued: NaN };
}

function meanError(observed: ArrayLike<number>, v: TemperatureVintage, last: number, limit: number): number {
  let s = 0;
  let k = 0;
  for (let i = last - RECENT_ERROR_HOURS + 1; i <= last; i++) {
    if (i < 0 || i >= limit) continue;
    const e = observed[i] - vintageMean(v, i);
    if (Number.isFinite(e)) {
      s += e;
      k++;
    }
  }
  return k ? s / k : NaN;
}

/**
 * The correction b_g·e₀ of the latest vintage by its error so far, and the corrected values'
 * standard errors, for steps 0..h−1 from `at` (NaN where it cannot be estimated; see header).
 */
export function recentErrorUpdate(observed: ArrayLike<number>, known: readonly TemperatureVintage[], latest: TemperatureVintage, at: number, h: number): { shift: Float64Array; sd: Float64Array } | null {
  const o = Math.floor(at);
  const limit = Math.min(o, observed.length);
  const e0 = meanError(observed, latest, o - 1, limit);
  if (!Number.isFinite(e0)) return null;
  const age = at - latest.issued;
  const sxy = new Float64Array(h);
  const sxx = new Float64Array(h);
  const cnt = new Float64Array(h);
  const pairs: Array<{ x: number; ys: Float64Array }> = [];
  for (const v of known) {
    if (v === latest) continue;
    const anchor = Math.floor(v.issued + age) - 1;
    if (anchor + 1 >= limit) continue;
    const x = meanError(observed, v, anchor, limit);
    if (!Number.isFinite(x)) continue;
    const ys = new Float64Array(h).fill(NaN);
    for (let j = 0; j < h; j++) {
      const i = anchor + 1 + j;
      if (i >= limit) break;
      const e = observed[i] - vintageMean(v, i);
      if (!Number.isFinite(e)) continue;
      ys[j] = e;
      sxy[j] += x * e;
      sxx[j] += x * x;
      cnt[j]++;
    }
    pairs.push({ x, ys });
  }
  const shift = new Float64Array(h).fill(NaN);
  const sd = new Float64Array(h).fill(NaN);
  for (let j = 0; j < h; j++) {
    if (cnt[j] < MIN_PAST_VINTAGES || !(sxx[j] > 0)) continue;
    const b = sxy[j] / sxx[j];
    let ss = 0;
    for (const p of pairs) if (Number.isFinite(p.ys[j])) ss += (p.ys[j] - b * p.x) ** 2;
    shift[j] = b * e0;
    sd[j] = Math.sqrt(ss / (cnt[j] - 1));
  }
  return { shift, sd };
}

/**
 * The latest few vintages, each corrected by its own error so far, combined with inverse-variance
 * weights (Bates & Granger 1969, "The combination of forecasts", Oper. Res. Q. 20, 451–468, whose
 * weights w_k ∝ 1/σ_k² leave out the covariances of the errors; estimating those from a few
 * weeks of errors made the combination worse, the "forecast combination puzzle": Smith & Wallis
 * 2009, Oxford Bull. Econ. Stat. 71, 331–355). For each of the COMBINED_VINTAGES latest vintages
 * and each step ahead: its value shifted by the correction b_g·e₀ of its recent error
 * (recentErrorUpdate, slopes from the past vintages at the same age) with σ_k the standard error
 * of that regression; where it cannot be corrected (a vintage issued so recently that none of its
 * hours has been observed) its own value with σ_k the measured error at its lead (leadErrors).
 * The combined value's standard error is (Σ 1/σ_k²)^−½, exact when the vintages err
 * independently and too small when they err alike (the band calibration sees the difference).
 * Returns NaN for a step no vintage with a known error covers.
 */
export function combineVintages(observed: ArrayLike<number>, known: readonly TemperatureVintage[], at: number, h: number, byLead?: Float64Array, fallback = NaN): { value: Float64Array; sd: Float64Array; vintages: number[] } {
  const current = known.slice(-COMBINED_VINTAGES);
  const o = Math.floor(at);
  const bins = byLead ?? leadErrors(observed, known, at);
  const updates = current.map((v) => recentErrorUpdate(observed, known, v, at, h));
  const value = new Float64Array(h).fill(NaN);
  const sd = new Float64Array(h).fill(NaN);
  const vintages = new Array<number>(h).fill(0);
  for (let j = 0; j < h; j++) {
    const i = o + j;
    let sw = 0;
    let swx = 0;
    for (let k = 0; k < current.length; k++) {
      const v = vintageMean(current[k], i);
      if (!Number.isFinite(v)) continue;
      const u = updates[k];
      const corrected = !!u && Number.isFinite(u.shift[j]) && Number.isFinite(u.sd[j]);
      const x = corrected ? v + u.shift[j] : v;
      const s = Math.max(MIN_VINTAGE_SD, corrected ? u.sd[j] : sdAtLead(bins, i - current[k].issued, fallback));
      if (!Number.isFinite(s)) continue;
      sw += 1 / (s * s);
      swx += x / (s * s);
      vintages[j]++;
    }
    if (sw > 0) {
      value[j] = swx / sw;
      sd[j] = Math.sqrt(1 / sw);
    }
  }
  return { value, sd, vintages };
}
