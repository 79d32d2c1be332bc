/**
 * Least squares for the concentrated regression coefficients: β̂ = argmin ‖ỹ − X̃β‖² over the
 * observed rows, by the normal equations scaled to unit diagonal (equilibration) and a
 * Cholesky factor; a column that adds nothing after the differencing (a constant, or a
 * combination of others) leaves a pivot at round-off size and is refused by name.
 */

export class CollinearError extends Error {}

export interface LeastSquares {
  beta: Float64Array;
  /** (X̃'X̃)⁻¹, row-major k×k */
  inverse: Float64Array;
}

/** Cross-products X'X (k×k) and X'y over rows where y is finite. */
export function crossProducts(cols: readonly Float64Array[], y: Float64Array): { XtX: Float64Array; Xty: Float64Array; yty: number } {
  const k = cols.length;
  const XtX = new Float64Array(k * k);
  const Xty = new Float64Array(k);
  let yty = 0;
  for (let t = 0; t < y.length; t++) {
    const yt = y[t];
    if (yt !== yt) continue;
    yty += yt * yt;
    for (let i = 0; i < k; i++) {
      const xi = cols[i][t];
      Xty[i] += xi * yt;
      for (let j = 0; j <= i; j++) XtX[i * k + j] += xi * cols[j][t];
    }
  }
  for (let i = 0; i < k; i++) for (let j = 0; j < i; j++) XtX[j * k + i] = XtX[i * k + j];
  return { XtX, Xty, yty };
}

/** Solves the normal equations; `names` only for the message when a column is collinear. */
export function solveNormal(XtX: Float64Array, Xty: Float64Array, names: readonly string[]): LeastSquares {
  const k = Xty.length;
  const d = new Float64Array(k);
  for (let i = 0; i < k; i++) {
    const v = XtX[i * k + i];
    if (!(v > 0)) throw new CollinearError(`regressor "${names[i]}" is zero on every hour used after the differencing`);
    d[i] = 1 / Math.sqrt(v);
  }
  // Cholesky of the equilibrated matrix D X'X D (unit diagonal)
  const L = new Float64Array(k * k);
  for (let i = 0; i < k; i++) {
    for (let j = 0; j <= i; j++) {
      let s = XtX[i * k + j] * d[i] * d[j];
      for (let m = 0; m < j; m++) s -= L[i * k + m] * L[j * k + m];
      if (i === j) {
        if (!(s > 1e-10)) throw new CollinearError(`regressor "${names[i]}" is (nearly) a combination of the ones before it after the differencing`);
        L[i * k + i] = Math.sqrt(s);
      } else L[i * k + j] = s / L[j * k + j];
    }
  }
  const solve = (b: Float64Array): Float64Array => {
    const z = new Float64Array(k);
    for (let i = 0; i < k; i++) {
      let s = b[i] * d[i];
      for (let m = 0; m < i; m++) s -= L[i * k + m] * z[m];
      z[i] = s / L[i * k + i];
    }
    for (let i = k - 1; i >= 0; i--) {
      let s = z[i];
      for (let m = i + 1; m < k; m++) s -= L[m * k + i] * z[m];
      z[i] = s / L[i * k + i];
    }
    for (let i = 0; i < k; i++) z[i] *= d[i];
    return z;
  };
  const beta = solve(Xty);
  const inverse = new Float64Array(k * k);
  const e = new Float64Array(k);
  for (let j = 0; j < k; j++) {
    e.fill(0);
    e[j] = 1;
    inverse.set(solve(e), j * k);
  }
  return { beta, inverse };
}
