/**
 * Starting values for ARMA estimation by the Hannan–Rissanen regression (Hannan & Rissanen
 * 1982): fit a long autoregression (here by Yule–Walker through the Durbin–Levinson recursion,
 * which is cheap even for the long orders a seasonal model needs), take its residuals as
 * estimates of the innovations, then regress the series on its own lags and the lagged
 * residuals by least squares. Seasonal lags enter as extra regressors at multiples of the
 * period (the cross terms of the multiplicative model are left out; these are only starting
 * values). Estimates outside the stationary / invertible region are shrunk back into it.
 */
import { Matrix, solve } from 'ml-matrix';
import { acf, yuleWalker } from '../series/acf';
import { isInvertible, isStationary } from './transform';

export interface HrOrders {
  p: number;
  q: number;
  P: number;
  Q: number;
  period: number;
}

export interface HrStart {
  ar: Float64Array;
  ma: Float64Array;
  sar: Float64Array;
  sma: Float64Array;
  /** residual variance of the second-stage regression (NaN when it was not run) */
  sigma2: number;
  /** rows used in the second-stage regression */
  rows: number;
}

/**
 * Hours the starting values are computed from at most (the latest ones). They are only a
 * starting point for the exact likelihood over the whole series; beyond a few thousand hours a
 * longer window moves them little and costs a third of a year-long fit.
 */
export const HR_MAX_HOURS = 3000;

export function hannanRissanen(series: ArrayLike<number>, o: HrOrders): HrStart {
  const { p, q, P, Q, period: s } = o;
  const all = series instanceof Float64Array ? series : Float64Array.from(series);
  // the window grows with a seasonal block so that it still holds several seasons of lags
  const keep = Math.max(HR_MAX_HOURS, 20 * s * Math.max(P, Q, 0));
  const x = all.length > keep ? all.subarray(all.length - keep) : all;
  const n = x.length;
  const zero = (): HrStart => ({ ar: new Float64Array(p), ma: new Float64Array(q), sar: new Float64Array(P), sma: new Float64Array(Q), sigma2: NaN, rows: 0 });
  if (p + q + P + Q === 0) return zero();
  let e: Float64Array | null = null;
  let m = 0;
  if (q + Q > 0) {
    m = Math.max(Math.floor(10 * Math.log10(Math.max(n, 10))), p + q + 1);
    if (P + Q > 0) m = Math.max(m, s * Math.max(P, Q) + Math.max(p, q) + 1);
    m = Math.min(m, Math.floor(n / 3));
    e = longArResiduals(x, yuleWalker(acf(x, m), m).phi, m);
  }
  const lagsX: number[] = [];
  for (let i = 1; i <= p; i++) lagsX.push(i);
  for (let j = 1; j <= P; j++) lagsX.push(j * s);
  const lagsE: number[] = [];
  for (let i = 1; i <= q; i++) lagsE.push(i);
  for (let j = 1; j <= Q; j++) lagsE.push(j * s);
  const k = lagsX.length + lagsE.length;
  const eq = normalEquations(x, e ?? new Float64Array(n).fill(NaN), Int32Array.from(lagsX), Int32Array.from(lagsE), Math.max(0, ...lagsX, ...lagsE.map((l) => l + m)));
  if (eq.rows <= k + 1) return zero();
  const A = new Matrix(k, k);
  for (let i = 0; i < k; i++) {
    for (let j = 0; j <= i; j++) {
      A.set(i, j, eq.XtX[i * k + j]);
      A.set(j, i, eq.XtX[i * k + j]);
    }
    A.set(i, i, A.get(i, i) * (1 + 1e-10));
  }
  let beta: number[];
  try {
    beta = solve(A, Matrix.columnVector(Array.from(eq.Xty))).getColumn(0);
  } catch {
    return zero();
  }
  if (!beta.every(Number.isFinite)) return zero();
  let rss = eq.yy;
  for (let i = 0; i < k; i++) rss -= beta[i] * eq.Xty[i];
  const start: HrStart = {
    sigma2: Math.max(rss, 0) / eq.rows,
    rows: eq.rows,
    ar: Float64Array.from(beta.slice(0, p)),
    sar: Float64Array.from(beta.slice(p, p + P)),
    ma: Float64Array.from(beta.slice(p + P, p + P + q)),
    sma: Float64Array.from(beta.slice(p + P + q, p + P + q + Q)),
  };
  start.ar = shrinkInto(start.ar, isStationary);
  start.sar = shrinkInto(start.sar, isStationary);
  start.ma = shrinkInto(start.ma, isInvertible);
  start.sma = shrinkInto(start.sma, isInvertible);
  return start;
}

// The two loops below are separate functions on purpose: inside one long function V8 compiled
// each loop on its own entry and threw the code away on reaching the next, on every call.

/** Residuals of the long autoregression φ (NaN for the first m hours and around missing ones). */
function longArResiduals(x: Float64Array, phi: Float64Array, m: number): Float64Array {
  const n = x.length;
  const e = new Float64Array(n).fill(NaN);
  for (let t = m; t < n; t++) {
    // two running sums, so the long sum does not wait on one addition at a time
    let v0 = x[t];
    let v1 = 0;
    let k = 1;
    for (; k < m; k += 2) {
      v0 -= phi[k - 1] * x[t - k];
      v1 -= phi[k] * x[t - k - 1];
    }
    if (k === m) v0 -= phi[m - 1] * x[t - m];
    e[t] = v0 + v1;
  }
  return e;
}

interface NormalEquations {
  /** lower triangle of X'X, row-major k×k */
  XtX: Float64Array;
  Xty: Float64Array;
  yy: number;
  rows: number;
}

/** X'X and X'y of the regression of x_t on x_{t−l} (l in lagsX) and e_{t−l} (l in lagsE), complete rows only. */
function normalEquations(x: Float64Array, e: Float64Array, lagsX: Int32Array, lagsE: Int32Array, maxLag: number): NormalEquations {
  const k = lagsX.length + lagsE.length;
  const XtX = new Float64Array(k * k);
  // X'y, with y'y in the last element
  const sums = new Float64Array(k + 1);
  const rows = accumulateRows(x, e, lagsX, lagsE, maxLag, XtX, sums);
  return { XtX, Xty: sums.subarray(0, k), yy: sums[k], rows };
}

/**
 * The loop of normalEquations, alone and returning only a local: it runs once per fit, so V8
 * enters its long loop through on-stack replacement, and code after the loop that needed type
 * feedback (building the result) threw that optimised code away on every call.
 */
function accumulateRows(x: Float64Array, e: Float64Array, lagsX: Int32Array, lagsE: Int32Array, maxLag: number, XtX: Float64Array, sums: Float64Array): number {
  const n = x.length;
  const kx = lagsX.length;
  const k = kx + lagsE.length;
  const row = new Float64Array(k);
  let rows = 0;
  for (let t = maxLag; t < n; t++) {
    const yt = x[t];
    if (!(yt === yt)) continue;
    let ok = true;
    for (let c = 0; c < kx; c++) {
      const v = x[t - lagsX[c]];
      if (!(v === v)) ok = false;
      row[c] = v;
    }
    for (let c = kx; c < k; c++) {
      const v = e[t - lagsE[c - kx]];
      if (!(v === v)) ok = false;
      row[c] = v;
    }
    if (!ok) continue;
    rows++;
    sums[k] += yt * yt;
    for (let i = 0; i < k; i++) {
      const ri = row[i];
      sums[i] += ri * yt;
      const base = i * k;
      for (let j = 0; j <= i; j++) XtX[base + j] += ri * row[j];
    }
  }
  return rows;
}

/** Scale coefficients toward zero until `ok` holds (a polynomial with root-modulus margin). */
function shrinkInto(c: Float64Array, ok: (c: Float64Array) => boolean): Float64Array {
  let cur = Float64Array.from(c);
  for (let i = 0; i < 30; i++) {
    const probe = cur.map((v) => v * 1.02);
    if (ok(probe)) return cur;
    cur = cur.map((v) => v * 0.85);
  }
  return new Float64Array(c.length);
}
