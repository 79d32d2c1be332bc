/**
 * The likelihood of regression with ARMA errors with β and σ² concentrated out, by GLS through
 * the Kalman filter (Harvey 1989, §3.4.2 and §7.4; Durbin & Koopman 2012, §6.2 on regression
 * in state space, and de Jong 1991 on the augmented filter): the filter's gains depend only on
 * the ARMA coefficients and on which hours are missing, never on the data, so filtering the
 * differenced load w and each differenced regressor column through the same filter gives the
 * standardized innovations ỹ = L⁻¹w and X̃ = L⁻¹X_w of one and the same triangular transform
 * (Var(w − X_wβ) = σ² L L'). Then for fixed ARMA coefficients
 *   β̂ = (X̃'X̃)⁻¹X̃'ỹ,   σ̂² = ‖ỹ − X̃β̂‖²/n,
 *   log L = −½ [ n log(2π σ̂²) + Σ log F_t + n ],
 * the exact Gaussian likelihood maximised over β and σ² (the profile likelihood). The search
 * then runs over the ARMA coefficients only: β is exact at every step instead of being searched
 * for alongside them (as R's arima does with optim), which removes the flat directions a
 * badly-scaled regressor (an intercept of 30,000 MW) puts into the search.
 */
import { kalmanFilter } from '../arma/kalman';
import { ArmaStateSpace } from '../arma/state-space';
import { crossProducts, solveNormal } from './least-squares';
import type { Design } from './design';

export interface Profile {
  beta: Float64Array;
  /** ‖ỹ − X̃β̂‖² (in units where the innovations have variance σ²) */
  ssq: number;
  sumLogF: number;
  nUsed: number;
  /** (X̃'X̃)⁻¹, row-major; σ̂² times it is the GLS covariance of β̂ for fixed ARMA coefficients */
  inverse: Float64Array;
}

/** Buffers of one fit, reused by every evaluation. */
export interface ProfileWork {
  wt: Float64Array;
  ct: Float64Array[];
  complete: boolean;
  tol: number;
}

export function profileWork(d: Design, tol: number): ProfileWork {
  let complete = true;
  for (let t = 0; t < d.w.length; t++) if (d.w[t] !== d.w[t]) complete = false;
  return { wt: new Float64Array(d.w.length), ct: d.wColumns.map((c) => new Float64Array(c.length)), complete, tol };
}

export function profileLikelihood(d: Design, ss: ArmaStateSpace, work: ProfileWork): Profile {
  const { wt, ct, complete, tol } = work;
  const f = kalmanFilter(d.w, ss, { mean: 0, tol, complete, residuals: wt });
  for (let j = 0; j < ct.length; j++) kalmanFilter(d.wColumns[j], ss, { mean: 0, tol, complete, residuals: ct[j] });
  const { beta, inverse, ssq } = glsStep(ct, wt, d.names);
  return { beta, ssq, sumLogF: f.sumLogF, nUsed: f.nUsed, inverse };
}

/**
 * The GLS step shared by both likelihood forms: β̂ the least-squares fit of the standardized
 * innovations ỹ (wt) on the standardized regressors X̃ (ct), and ‖ỹ − X̃β̂‖² over the hours that
 * have an innovation, summed row by row (not ỹ'ỹ − β̂'X̃'ỹ, which cancels digits when the
 * regressors explain most of the load).
 */
export function glsStep(ct: readonly Float64Array[], wt: Float64Array, names: readonly string[]): { beta: Float64Array; inverse: Float64Array; ssq: number } {
  const k = ct.length;
  let beta: Float64Array = new Float64Array(0);
  let inverse: Float64Array = new Float64Array(0);
  if (k > 0) {
    const cp = crossProducts(ct, wt);
    const ls = solveNormal(cp.XtX, cp.Xty, names);
    beta = ls.beta;
    inverse = ls.inverse;
  }
  let ssq = 0;
  for (let t = 0; t < wt.length; t++) {
    let e = wt[t];
    if (e !== e) continue;
    for (let j = 0; j < k; j++) e -= ct[j][t] * beta[j];
    ssq += e * e;
  }
  return { beta, inverse, ssq };
}

/** The errors of the differenced regression, w − X_w β (NaN where w is missing). */
export function differencedErrors(d: Design, beta: ArrayLike<number>): Float64Array {
  const e = Float64Array.from(d.w);
  for (let j = 0; j < d.wColumns.length; j++) {
    const c = d.wColumns[j];
    const b = beta[j];
    for (let t = 0; t < e.length; t++) e[t] -= c[t] * b;
  }
  return e;
}
