/**
 * Differencing operators (1 − B^s) for any lag s, composed by polynomial multiplication
 * (Box & Jenkins 1970, ch. 4), with exact inversion of forecasts and of their error variance.
 *
 * The combined operator is Δ(B) = Π (1 − B^{s_i}) = 1 + Σ c_k B^k. A forecast error of the
 * load, e_y(n+h), equals Σ_{j=1..h} ξ_{h−j} e_w(n+j), where ξ are the ψ-weights of 1/Δ(B)
 * (every forecast error of the differenced series w adds into the load through them).
 */

/** Coefficients c[0..D] of Δ(B) = Π (1 − B^s) (c[0] = 1). */
export function differencePolynomial(lags: readonly number[]): Float64Array {
  let poly = new Float64Array([1]);
  for (const s of lags) {
    if (!Number.isInteger(s) || s < 1) throw new Error(`differencing lag must be a positive integer, got ${s}`);
    const next = new Float64Array(poly.length + s);
    for (let i = 0; i < poly.length; i++) {
      next[i] += poly[i];
      next[i + s] -= poly[i];
    }
    poly = next;
  }
  return poly;
}

/** Number of leading observations lost to the differencing (the degree of Δ). */
export function differenceOrder(lags: readonly number[]): number {
  return lags.reduce((a, b) => a + b, 0);
}

/**
 * w_t = Δ(B) y_t for t = D..n−1; the result has length n − D and index i of the result is
 * hour D + i of the input. A missing hour makes every w that uses it missing.
 */
export function difference(y: ArrayLike<number>, lags: readonly number[]): Float64Array {
  const c = differencePolynomial(lags);
  const D = c.length - 1;
  const n = y.length;
  if (n <= D) return new Float64Array(0);
  const out = new Float64Array(n - D);
  for (let t = D; t < n; t++) {
    let s = 0;
    for (let k = 0; k <= D; k++) {
      const ck = c[k];
      if (ck !== 0) s += ck * y[t - k];
    }
    out[t - D] = s;
  }
  return out;
}

/**
 * Inverse of `difference`: given the first D values of y and the differenced series w,
 * rebuild y (length D + w.length).
 */
export function integrate(w: ArrayLike<number>, initial: ArrayLike<number>, lags: readonly number[]): Float64Array {
  const c = differencePolynomial(lags);
  const D = c.length - 1;
  if (initial.length !== D) throw new Error(`need ${D} initial values, got ${initial.length}`);
  const y = new Float64Array(D + w.length);
  for (let i = 0; i < D; i++) y[i] = initial[i];
  for (let t = D; t < y.length; t++) {
    let s = w[t - D];
    for (let k = 1; k <= D; k++) {
      const ck = c[k];
      if (ck !== 0) s -= ck * y[t - k];
    }
    y[t] = s;
  }
  return y;
}

/**
 * Continue a load series into the future: `history` holds the observed (or filled) load up to
 * the forecast origin and `wForecast` the forecasts of the differenced series for the next
 * hours; returns the load forecasts, y_t = w_t − Σ_{k≥1} c_k y_{t−k}.
 */
export function extendForecast(history: ArrayLike<number>, wForecast: ArrayLike<number>, lags: readonly number[]): Float64Array {
  const c = differencePolynomial(lags);
  const D = c.length - 1;
  const n = history.length;
  if (n < D) throw new Error(`need at least ${D} hours of history to undo the differencing`);
  const h = wForecast.length;
  const y = new Float64Array(D + h);
  for (let i = 0; i < D; i++) y[i] = history[n - D + i];
  for (let j = 0; j < h; j++) {
    const t = D + j;
    let s = wForecast[j];
    for (let k = 1; k <= D; k++) {
      const ck = c[k];
      if (ck !== 0) s -= ck * y[t - k];
    }
    y[t] = s;
  }
  return y.subarray(D);
}

/** ψ-weights ξ_0..ξ_{h−1} of 1/Δ(B). */
export function integrationWeights(lags: readonly number[], h: number): Float64Array {
  const c = differencePolynomial(lags);
  const xi = new Float64Array(h);
  for (let j = 0; j < h; j++) {
    let s = j === 0 ? 1 : 0;
    for (let k = 1; k <= Math.min(j, c.length - 1); k++) s -= c[k] * xi[j - k];
    xi[j] = s;
  }
  return xi;
}

/**
 * Forecast-error variances of the load at horizons 1..h from the joint covariance of the
 * differenced-series forecast errors (row-major h×h, `cov[i*h+j]`).
 */
export function integratedVariance(cov: Float64Array, h: number, lags: readonly number[]): Float64Array {
  const xi = integrationWeights(lags, h);
  const out = new Float64Array(h);
  for (let t = 0; t < h; t++) {
    let s = 0;
    for (let i = 0; i <= t; i++) {
      const wi = xi[t - i];
      if (wi === 0) continue;
      for (let j = 0; j <= t; j++) {
        const wj = xi[t - j];
        if (wj !== 0) s += wi * wj * cov[i * h + j];
      }
    }
    out[t] = s;
  }
  return out;
}

/** Human-readable name of a differencing, e.g. "(1−B^24)(1−B^168)". */
export function describeDifferencing(lags: readonly number[]): string {
  if (lags.length === 0) return 'none';
  return lags.map((s) => (s === 1 ? '(1−B)' : `(1−B^${s})`)).join('');
}
