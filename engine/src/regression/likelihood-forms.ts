/**
 * The two forms of the likelihood the estimator maximises, behind one interface:
 *  - `differenced`: the exact likelihood of the differenced data (profile.ts), the engine's
 *    usual form, fast (the steady-state filter); used whenever there is no gap, or no
 *    differencing, and for differenced series with gaps too long for the diffuse form;
 *  - `diffuse`: the state-space form of the undifferenced errors with a diffuse start, R's arima's
 *    (diffuse-filter.ts), for a differenced series with gaps when m²·n ≤ DIFFUSE_MAX_WORK (state
 *    size m = ARMA state + the differencing's degree, n hours): it keeps the information across a
 *    gap that differencing loses, and gives R's log-likelihood there. Its filter never reaches a
 *    steady state cheaply (O(m²) an hour), so the desk's hourly series (m ≥ 27 under (1 − B^24),
 *    1,000+ hours) stay in the differenced form, which drops the few differenced values that
 *    touch a gap: 1.5 s against 0.02 s for eight weeks with three regressors, measured.
 * Each form gives the search's objective, the final figures, −log L at given coefficients and β
 * (for the Hessian) and what the forecasts start from.
 */
import { ArmaStateSpace } from '../arma/state-space';
import { concentratedLogLik, kalmanFilter } from '../arma/kalman';
import { differenceOrder } from '../series/differencing';
import { fillHistory } from '../series/fill-history';
import type { Design } from './design';
import { diffuseFilter, diffuseModel } from './diffuse-filter';
import { diffuseLogLik, diffuseNegLogLik, diffuseProfile, observedHours } from './diffuse-profile';
import type { ForecastState } from './forecast-regression';
import { differencedErrors, Profile, profileLikelihood, profileWork } from './profile';

/** Largest m²·n (state size squared times hours) the diffuse form is used for: monthly and quarterly series, not the hourly desk. */
export const DIFFUSE_MAX_WORK = 500_000;

export interface Estimate {
  beta: Float64Array;
  sigma2: number;
  loglik: number;
  nUsed: number;
  /** (X̃'X̃)⁻¹ of the GLS step */
  inverse: Float64Array;
}

export interface ErrorsState {
  errors: Float64Array;
  residuals: Float64Array;
  forecast: ForecastState;
}

export interface LikelihoodForm {
  kind: 'differenced' | 'diffuse';
  /** −log L / n up to constants, with β and σ² concentrated out (what the search minimises) */
  objective(ss: ArmaStateSpace): number;
  estimate(ss: ArmaStateSpace): Estimate;
  negLogLik(ss: ArmaStateSpace, beta: ArrayLike<number>): number;
  state(ss: ArmaStateSpace, beta: Float64Array, sigma2: number): ErrorsState;
}

/** y − Xβ on the load's timeline. */
function levelErrors(d: Design, beta: ArrayLike<number>): Float64Array {
  const errors = Float64Array.from(d.y);
  for (let j = 0; j < d.columns.length; j++) {
    const c = d.columns[j];
    for (let t = 0; t < errors.length; t++) errors[t] -= c[t] * beta[j];
  }
  return errors;
}

/** The form for this design (see the header); `armaState` is the ARMA state's size r. */
export function chooseForm(d: Design, diff: number[], armaState: number): LikelihoodForm {
  let gaps = false;
  for (let t = 0; t < d.y.length; t++) if (d.y[t] !== d.y[t]) gaps = true;
  const D = differenceOrder(diff);
  const m = armaState + D;
  return D > 0 && gaps && m * m * d.y.length <= DIFFUSE_MAX_WORK ? diffuseForm(d, diff) : differencedForm(d, diff);
}

export function differencedForm(d: Design, diff: number[], tol = 1e-10): LikelihoodForm {
  const work = profileWork(d, tol);
  const figures = (pr: Profile): Estimate => {
    const n = pr.nUsed;
    const sigma2 = pr.ssq / n;
    return { beta: pr.beta, sigma2, loglik: -0.5 * (n * Math.log(2 * Math.PI * sigma2) + pr.sumLogF + n), nUsed: n, inverse: pr.inverse };
  };
  return {
    kind: 'differenced',
    objective(ss) {
      const pr = profileLikelihood(d, ss, work);
      return pr.ssq > 0 ? 0.5 * Math.log(pr.ssq / pr.nUsed) + (0.5 * pr.sumLogF) / pr.nUsed : Infinity;
    },
    estimate: (ss) => figures(profileLikelihood(d, ss, work)),
    negLogLik(ss, beta) {
      return -concentratedLogLik(kalmanFilter(differencedErrors(d, beta), ss, { mean: 0, tol, complete: work.complete }));
    },
    state(ss, beta, sigma2) {
      const n = d.y.length;
      const e = differencedErrors(d, beta);
      const res = new Float64Array(e.length);
      const pred = new Float64Array(e.length);
      const f = kalmanFilter(e, ss, { mean: 0, tol, residuals: res, predictions: pred, keepState: true });
      const errors = levelErrors(d, beta);
      const residuals = new Float64Array(n).fill(NaN);
      residuals.set(res, n - e.length);
      // missing past errors that undoing the differencing needs: the model's predictions
      const filled = diff.length ? fillHistory(errors, diff, pred).filled : errors;
      return { errors, residuals, forecast: { ss, aEnd: f.aPred as Float64Array, PEnd: f.PPred as Float64Array, sigma2, diff, filledErrors: filled, names: d.names, beta } };
    },
  };
}

export function diffuseForm(d: Design, diff: number[]): LikelihoodForm {
  const observed = observedHours(d.y);
  let nObserved = -differenceOrder(diff);
  for (let t = 0; t < observed.length; t++) nObserved += observed[t];
  return {
    kind: 'diffuse',
    objective(ss) {
      const pr = diffuseProfile(d, diff, ss, observed);
      return pr.ssq > 0 ? 0.5 * Math.log(pr.ssq / pr.nu) + (0.5 * pr.sumLogF) / pr.nu : Infinity;
    },
    estimate(ss) {
      const pr = diffuseProfile(d, diff, ss, observed);
      return { beta: pr.beta, sigma2: pr.ssq / pr.nObserved, loglik: diffuseLogLik(pr.ssq, pr.sumLogF, pr.nu, pr.nObserved), nUsed: pr.nObserved, inverse: pr.inverse };
    },
    negLogLik: (ss, beta) => diffuseNegLogLik(d, diff, ss, beta, observed, nObserved),
    state(ss, beta, sigma2) {
      const errors = levelErrors(d, beta);
      const md = diffuseModel(ss, diff);
      const pass = diffuseFilter(md, [errors], observed, true);
      return {
        errors,
        residuals: pass.std[0],
        forecast: { ss, aEnd: new Float64Array(0), PEnd: new Float64Array(0), sigma2, diff, filledErrors: errors, names: d.names, beta, diffuse: { model: md, a: (pass.a as Float64Array[])[0], P: pass.P as Float64Array } },
      };
    },
  };
}
