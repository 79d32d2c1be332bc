/**
 * Sample autocorrelation function (Box & Jenkins 1970) and partial autocorrelation function by
 * the Durbin–Levinson recursion (Levinson 1947; Durbin 1960).
 *
 * Missing values are handled pairwise: each lag sums the products of the pairs where both
 * values exist and divides by (pairs + lag), which is n when nothing is missing; this is the
 * convention of R's `acf(..., na.action = na.pass)`, so Ljung–Box matches R's `Box.test`.
 */
import { meanFinite } from './series';

/** Autocovariances γ(0..maxLag) with the mean of the finite values removed. */
export function autocovariance(x: ArrayLike<number>, maxLag: number): Float64Array {
  const n = x.length;
  const m = meanFinite(x);
  const d = new Float64Array(n);
  for (let i = 0; i < n; i++) d[i] = x[i] - m;
  const out = new Float64Array(maxLag + 1);
  let complete = true;
  for (let i = 0; i < n && complete; i++) complete = d[i] === d[i];
  for (let lag = 0; lag <= maxLag; lag++) {
    if (complete) {
      // no missing value: four running sums, so the additions do not wait on one another
      const end = n - lag;
      let s0 = 0;
      let s1 = 0;
      let s2 = 0;
      let s3 = 0;
      let i = 0;
      for (; i + 3 < end; i += 4) {
        s0 += d[i] * d[i + lag];
        s1 += d[i + 1] * d[i + 1 + lag];
        s2 += d[i + 2] * d[i + 2 + lag];
        s3 += d[i + 3] * d[i + 3 + lag];
      }
      for (; i < end; i++) s0 += d[i] * d[i + lag];
      out[lag] = end > 0 ? (s0 + s1 + s2 + s3) / n : NaN;
      continue;
    }
    let s = 0;
    let pairs = 0;
    for (let i = 0; i + lag < n; i++) {
      const p = d[i] * d[i + lag];
      if (p === p) {
        s += p;
        pairs++;
      }
    }
    out[lag] = pairs > 0 ? s / (pairs + lag) : NaN;
  }
  return out;
}

/** Autocorrelations ρ(0..maxLag); ρ(0) = 1. */
export function acf(x: ArrayLike<number>, maxLag: number): Float64Array {
  const g = autocovariance(x, maxLag);
  const out = new Float64Array(maxLag + 1);
  for (let k = 0; k <= maxLag; k++) out[k] = g[k] / g[0];
  return out;
}

/**
 * The Durbin–Levinson recursion on the autocorrelations, run to order m: the AR(m) coefficients
 * and the innovation variance ratio v = σ²/γ(0), with each order's last coefficient φ_kk (the
 * partial autocorrelation at lag k) handed to `onOrder` as it is found.
 */
function durbinLevinson(rho: ArrayLike<number>, m: number, onOrder?: (k: number, phiKK: number) => void): { phi: Float64Array; v: number } {
  let phi = new Float64Array(0);
  let v = 1;
  for (let k = 1; k <= m; k++) {
    let num = rho[k];
    for (let j = 1; j < k; j++) num -= phi[j - 1] * rho[k - j];
    const a = v > 0 ? num / v : 0;
    const next = new Float64Array(k);
    for (let j = 1; j < k; j++) next[j - 1] = phi[j - 1] - a * phi[k - j - 1];
    next[k - 1] = a;
    phi = next;
    v *= 1 - a * a;
    onOrder?.(k, a);
  }
  return { phi, v };
}

/** Partial autocorrelations φ_kk for k = 1..maxLag (index 0 of the result is lag 1), by Durbin–Levinson. */
export function pacfFromAcf(rho: ArrayLike<number>, maxLag: number): Float64Array {
  const out = new Float64Array(maxLag);
  durbinLevinson(rho, maxLag, (k, a) => (out[k - 1] = a));
  return out;
}

export function pacf(x: ArrayLike<number>, maxLag: number): Float64Array {
  return pacfFromAcf(acf(x, maxLag), maxLag);
}

/** Yule–Walker AR(m) coefficients from the autocorrelations, with the variance ratio v = σ²/γ(0). */
export function yuleWalker(rho: ArrayLike<number>, m: number): { phi: Float64Array; v: number } {
  return durbinLevinson(rho, m);
}

/** The ±1.96/√n band for a white-noise ACF, n counting the finite values. */
export function acfBand(nFinite: number, z = 1.96): number {
  return z / Math.sqrt(nFinite);
}
