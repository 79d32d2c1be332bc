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
import { acf, yuleWalker } from '../acf';
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

export function hannanRissanen(x: ArrayLike<number>, o: HrOrders): HrStart {
  const n = x.length;
  const { p, q, P, Q, period: s } = o;
  const zero = (): HrStart => ({ ar: new Float64Array(p), ma: new Float64Array(q), sar: new Float64Array(P), sma: new Float64Array(Q), sigma2: NaN, rows: 0 });
  if (p + q + P + Q === 0) return zero();
  const needResid = q + Q > 0;
  let e: Float64Array | null = null;
  let m = 0;
  if (needResid) {
    m = Math.max(Math.floor(10 * Math.log10(Math.max(n, 10))), p + q + 1);
    if (P + Q > 0) m = Math.max(m, s * Math.max(P, Q) + Math.max(p, q) + 1);
    m = Math.min(m, Math.floor(n / 3));
    const rho = acf(x, m);
    const { phi } = yuleWalker(rho, m);
    e = new Float64Array(n).fill(NaN);
    for (let t = m; t < n; t++) {
      let v = x[t];
      for (let k = 1; k <= m; k++) v -= phi[k - 1] * x[t - k];
      e[t] = v;
    }
  }
  const lagsX: number[] = [];
  for (let i = 1; i <= p; i++) lagsX.push(i);
  for (let j = 1; j <= P; j++) lagsX.push(j * s);
  const lagsE: number[] = [];
  for (let i = 1; i <= q; i++) lagsE.push(i);
  for (let j = 1; j <= Q; j++) lagsE.push(j * s);
  const maxLag = Math.max(0, ...lagsX, ...lagsE.map((l) => l + m));
  const k = lagsX.length + lagsE.length;
  // normal equations accumulated directly (no n×k matrix)
  const XtX = new Float64Array(k * k);
  const Xty = new Float64Array(k);
  const row = new Float64Array(k);
  let rows = 0;
  let yy = 0;
  for (let t = maxLag; t < n; t++) {
    const yt = x[t];
    if (!(yt === yt)) continue;
    let ok = true;
    let c = 0;
    for (const l of lagsX) {
      const v = x[t - l];
      if (!(v === v)) ok = false;
      row[c++] = v;
    }
    for (const l of lagsE) {
      const v = e ? e[t - l] : NaN;
      if (!(v === v)) ok = false;
      row[c++] = v;
    }
    if (!ok) continue;
    rows++;
    yy += yt * yt;
    for (let i = 0; i < k; i++) {
      Xty[i] += row[i] * yt;
      for (let j = 0; j <= i; j++) XtX[i * k + j] += row[i] * row[j];
    }
  }
  if (rows <= k + 1) return zero();
  const A = new Matrix(k, k);
  for (let i = 0; i < k; i++) {
    for (let j = 0; j <= i; j++) {
      A.set(i, j, XtX[i * k + j]);
      A.set(j, i, XtX[i * k + j]);
    }
    A.set(i, i, A.get(i, i) * (1 + 1e-10));
  }
  let beta: number[];
  try {
    beta = solve(A, Matrix.columnVector(Array.from(Xty))).getColumn(0);
  } catch {
    return zero();
  }
  if (!beta.every(Number.isFinite)) return zero();
  let rss = yy;
  for (let i = 0; i < k; i++) rss -= beta[i] * Xty[i];
  const start: HrStart = {
    sigma2: Math.max(rss, 0) / rows,
    rows,
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
