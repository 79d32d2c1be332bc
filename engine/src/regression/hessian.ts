/**
 * Standard errors of the ARMA and regression coefficients together, from the inverse of the
 * Hessian of the full −log L (σ² concentrated, β an explicit parameter) at the estimate — the
 * observed information, as R's arima reports var.coef (there from optim's numerical Hessian).
 * The Hessian is taken by central differences in the natural parameters, each coefficient
 * stepped by a thousandth of its own scale (the ARMA coefficients by 1e-4, β_j by 1e-3 of its
 * GLS standard error for fixed ARMA coefficients), so that the steps are alike in units of the
 * likelihood's curvature; the error of central differences is O(h²), far below the 1 % the
 * standard errors are checked to.
 */
import { inverse, Matrix } from 'ml-matrix';
import { ArmaSpec, splitNatural, stateSpaceOf } from '../arma/fit';
import { concentratedLogLik, kalmanFilter } from '../arma/kalman';
import type { Design } from './design';
import { differencedErrors } from './profile';


export function regressionHessianSe(
  d: Design,
  o: Required<ArmaSpec>,
  armaValues: number[],
  beta: Float64Array,
  sigma2: number,
  glsInverse: Float64Array,
  tol: number,
): number[] {
  const ka = armaValues.length;
  const kb = beta.length;
  const m = ka + kb;
  if (m === 0) return [];
  let complete = true;
  for (let t = 0; t < d.w.length; t++) if (d.w[t] !== d.w[t]) complete = false;
  const values = [...armaValues, ...beta];
  const hs = values.map((_, i) => (i < ka ? 1e-4 : 1e-3 * Math.sqrt(sigma2 * glsInverse[(i - ka) * kb + (i - ka)]) || 1e-6));
  const f = (v: number[]): number => {
    try {
      const ss = stateSpaceOf(splitNatural(v, o), o.period);
      const e = differencedErrors(d, v.slice(ka));
      const ll = concentratedLogLik(kalmanFilter(e, ss, { mean: 0, tol, complete }));
      return Number.isFinite(ll) ? -ll : NaN;
    } catch {
      return NaN;
    }
  };
  const at = (steps: Array<[number, number]>): number => {
    const v = values.slice();
    for (const [i, s] of steps) v[i] += s * hs[i];
    return f(v);
  };
  const f0 = f(values);
  const H = new Matrix(m, m);
  for (let i = 0; i < m; i++) {
    H.set(i, i, (at([[i, 1]]) - 2 * f0 + at([[i, -1]])) / (hs[i] * hs[i]));
    for (let j = 0; j < i; j++) {
      const v = (at([[i, 1], [j, 1]]) - at([[i, 1], [j, -1]]) - at([[i, -1], [j, 1]]) + at([[i, -1], [j, -1]])) / (4 * hs[i] * hs[j]);
      H.set(i, j, v);
      H.set(j, i, v);
    }
  }
  try {
    const V = inverse(H);
    return values.map((_, i) => {
      const v = V.get(i, i);
      return v > 0 && Number.isFinite(v) ? Math.sqrt(v) : NaN;
    });
  } catch {
    return values.map(() => NaN);
  }
}
