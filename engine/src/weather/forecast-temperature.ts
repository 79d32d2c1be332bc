/**
 * The temperature a forecast issued at time `at` works with, and how uncertain it is, from what
 * was known then only (./vintages):
 *  - hours that ended by `at` keep their observed temperature (no uncertainty);
 *  - later hours take the latest vintage issued at or before `at` that covers them (an older one
 *    where the latest has no value), its member mean, and each member's path for the spread;
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
 * The vintage's own error so far. By the issue time the latest vintage has already been wrong
 * for some hours (it was issued hours earlier, and those hours have been observed), and a
 * temperature forecast's errors persist over many hours (a front early or late). So its forecast
 * for the hours ahead is corrected by its recent error: with e₀ its mean error over the last
 * three observed hours and g the hours from the last observed one, the correction is b_g·e₀,
 * b_g the least-squares slope (no intercept) of the error g hours later on e₀ over the past
 * vintages at the same age (each taken at as many hours after its issue as the latest one is
 * now), and the standard error of the corrected value is the root mean square of those
 * regressions' residuals. Where the errors do not persist b_g is near 0 and nothing changes.
 * This is the measured-error approach above made conditional on what has been observed
 * (regression on the current error is a common practice of updating a forecast with
 * observations, as in model output statistics: Glahn & Lowry 1972, J. Appl. Meteor. 11,
 * 1203–1211).
 */
import { knownVintages, TemperatureVintage, vintageMean } from './vintages';

export const LEAD_BIN_HOURS = 12;
/** the latest vintages combined (./forecast-temperature, combineVintages) */
export const COMBINED_VINTAGES = 4;
/** hours of the vintage's latest errors averaged into e₀ */
export const RECENT_ERROR_HOURS = 3;
/** past vintages needed for a slope b_g */
const MIN_PAST_VINTAGES = 10;
const MIN_ERRORS_PER_BIN = 24;

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
  const combined = combineVintages(observed, known, at, h);
  const update = latest && !combined ? recentErrorUpdate(observed, known, latest, at, h) : null;
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
      const c = combined ? combined.value(i, j) : NaN;
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
  if (latest && latest.members.length > 1 && !combined) {
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
 * The latest few vintages combined with minimum-variance weights (Bates & Granger 1969, "The
 * combination of forecasts", Oper. Res. Q. 20, 451–468): w = Σ⁻¹1 / 1′Σ⁻¹1, with Σ the covariance
 * of the vintages' errors at the same ages, measured on the days before (the same issue time
 * 1, 2, … days earlier, each with the vintages it knew then, on hours observed by now), per
 * 12-hour bin of the steps ahead; the combined value's variance is 1 / 1′Σ⁻¹1. Where successive
 * forecasts err alike the weights go to the latest (it is the best informed); where their errors
 * are independent the older ones are averaged in. Returns null when the days before give too
 * few errors (fewer than 48 per bin), when the ages of the vintages differ from those of the
 * days before (a late or missed issue), or when a weight comes out below −0.5 (an unstable Σ);
 * the latest vintage alone is used then.
 */
export function combineVintages(observed: ArrayLike<number>, known: readonly TemperatureVintage[], at: number, h: number): { value: (i: number, j: number) => number; sd: Float64Array; weights: Float64Array[] } | null {
  const K = COMBINED_VINTAGES;
  if (known.length < K) return null;
  const current = known.slice(-K);
  const ages = current.map((v) => at - v.issued);
  const o = Math.floor(at);
  const limit = Math.min(o, observed.length);
  const bins = Math.ceil(h / LEAD_BIN_HOURS);
  const S = Array.from({ length: bins }, () => new Float64Array(K * K));
  const cnt = new Float64Array(bins);
  const e = new Float64Array(K);
  for (let d = 1; at - 24 * d > 0; d++) {
    const o2 = at - 24 * d;
    const then = knownVintages(known, o2).slice(-K);
    if (then.length < K || then.some((v, k) => Math.abs(o2 - v.issued - ages[k]) > 0.01)) continue;
    const base = Math.floor(o2);
    for (let j = 0; j < h; j++) {
      const i = base + j;
      if (i >= limit) break;
      let ok = Number.isFinite(observed[i]);
      for (let k = 0; k < K && ok; k++) {
        e[k] = observed[i] - vintageMean(then[k], i);
        ok = Number.isFinite(e[k]);
      }
      if (!ok) continue;
      const b = Math.floor(j / LEAD_BIN_HOURS);
      for (let k = 0; k < K; k++) for (let l = 0; l < K; l++) S[b][k * K + l] += e[k] * e[l];
      cnt[b]++;
    }
  }
  const weights: Float64Array[] = [];
  const varByBin = new Float64Array(bins);
  for (let b = 0; b < bins; b++) {
    if (cnt[b] < 48) return null;
    const w = solveSmall(S[b].map((x) => x / cnt[b]), K);
    if (!w) return null;
    let sum = 0;
    for (let k = 0; k < K; k++) sum += w[k];
    if (!(sum > 0)) return null;
    for (let k = 0; k < K; k++) w[k] /= sum;
    if (w.some((x) => x < -0.5)) return null;
    weights.push(w);
    varByBin[b] = 1 / sum;
  }
  const sd = new Float64Array(h);
  for (let j = 0; j < h; j++) sd[j] = Math.sqrt(varByBin[Math.floor(j / LEAD_BIN_HOURS)]);
  const value = (i: number, j: number): number => {
    const w = weights[Math.floor(j / LEAD_BIN_HOURS)];
    let s = 0;
    for (let k = 0; k < K; k++) {
      const v = vintageMean(current[k], i);
      if (!Number.isFinite(v)) return NaN;
      s += w[k] * v;
    }
    return s;
  };
  return { value, sd, weights };
}

/** Σ⁻¹1 for a small symmetric positive-definite Σ (Gaussian elimination with partial pivoting); null when singular. */
function solveSmall(sigma: Float64Array, K: number): Float64Array | null {
  const a = Array.from({ length: K }, (_, r) => [...Array.from(sigma.subarray(r * K, r * K + K)), 1]);
  for (let c = 0; c < K; c++) {
    let p = c;
    for (let r = c + 1; r < K; r++) if (Math.abs(a[r][c]) > Math.abs(a[p][c])) p = r;
    if (!(Math.abs(a[p][c]) > 1e-12)) return null;
    [a[c], a[p]] = [a[p], a[c]];
    for (let r = 0; r < K; r++) {
      if (r === c) continue;
      const f = a[r][c] / a[c][c];
      for (let k = c; k <= K; k++) a[r][k] -= f * a[c][k];
    }
  }
  return Float64Array.from({ length: K }, (_, r) => a[r][K] / a[r][r]);
}
