/**
 * Standard errors from the inverse of the Hessian of −log L at the estimate — the observed
 * information, as R's arima reports var.coef (there from optim's numerical Hessian). Taken by
 * central differences, each coefficient stepped by its own `step` (the caller sets them alike
 * in units of the likelihood's curvature: 1e-4 for ARMA coefficients, 1e-3 of a GLS standard
 * error for β); the error of central differences is O(h²), far below the 1 % the standard errors
 * are checked to. 2m² likelihood evaluations for m coefficients.
 */
import { inverse, Matrix } from 'ml-matrix';

export interface Covariance {
  /** standard errors, NaN where the inverse has no positive diagonal */
  se: number[];
  /** the inverse Hessian, row-major m×m (NaN when it could not be inverted) */
  cov: Float64Array;
}

export function hessianStandardErrors(values: readonly number[], steps: readonly number[], negLogLik: (v: number[]) => number): Covariance {
  const m = values.length;
  if (m === 0) return { se: [], cov: new Float64Array(0) };
  const f = (v: number[]): number => {
    try {
      const x = negLogLik(v);
      return Number.isFinite(x) ? x : NaN;
    } catch {
      return NaN;
    }
  };
  const at = (moves: Array<[number, number]>): number => {
    const v = values.slice();
    for (const [i, s] of moves) v[i] += s * steps[i];
    return f(v);
  };
  const f0 = f(values.slice());
  const H = new Matrix(m, m);
  for (let i = 0; i < m; i++) {
    H.set(i, i, (at([[i, 1]]) - 2 * f0 + at([[i, -1]])) / (steps[i] * steps[i]));
    for (let j = 0; j < i; j++) {
      const v = (at([[i, 1], [j, 1]]) - at([[i, 1], [j, -1]]) - at([[i, -1], [j, 1]]) + at([[i, -1], [j, -1]])) / (4 * steps[i] * steps[j]);
      H.set(i, j, v);
      H.set(j, i, v);
    }
  }
  try {
    const V = inverse(H);
    const cov = new Float64Array(m * m);
    for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) cov[i * m + j] = V.get(i, j);
    const se = values.map((_, i) => {
      const v = V.get(i, i);
      return v > 0 && Number.isFinite(v) ? Math.sqrt(v) : NaN;
    });
    return { se, cov };
  } catch {
    return { se: values.map(() => NaN), cov: new Float64Array(m * m).fill(NaN) };
  }
}
