/**
 * β and σ² concentrated out of the likelihood of a differenced model with gaps (the diffuse
 * state-space form of diffuse-filter.ts), as profile.ts does for the differenced data: the
 * undifferenced load and each regressor column run through the same gains, β̂ the least-squares
 * fit of the standardized innovations. The log-likelihood is R's arima's for this case:
 *   log L = −½ [ n log(ssq/ν) + n Σlog F / ν + n + n log 2π ],  σ̂² = ssq/n,
 * ν the observations in the likelihood and n the observed hours less the differencing's degree
 * (R 4.2.2, stats::arima: n.used; the two are equal unless a gap is as long as a season).
 */
import { ArmaStateSpace } from '../arma/state-space';
import { differenceOrder } from '../series/differencing';
import type { Design } from './design';
import { diffuseFilter, diffuseModel, DiffuseModel } from './diffuse-filter';
import { glsStep, type Profile } from './profile';

export interface DiffuseProfile extends Profile {
  /** R's n.used */
  nObserved: number;
  /** ν */
  nu: number;
}

export function observedHours(y: Float64Array): Uint8Array {
  const o = new Uint8Array(y.length);
  for (let t = 0; t < y.length; t++) o[t] = y[t] === y[t] ? 1 : 0;
  return o;
}

export function diffuseProfile(d: Design, diff: readonly number[], ss: ArmaStateSpace, observed: Uint8Array): DiffuseProfile {
  const md: DiffuseModel = diffuseModel(ss, diff);
  const pass = diffuseFilter(md, [d.y, ...d.columns], observed);
  const wt = pass.std[0];
  const ct = pass.std.slice(1);
  const { beta, inverse, ssq } = glsStep(ct, wt, d.names);
  let count = 0;
  for (let t = 0; t < observed.length; t++) count += observed[t];
  return { beta, ssq, sumLogF: pass.sumLogF, nUsed: pass.nu, nu: pass.nu, nObserved: count - differenceOrder(diff), inverse };
}

/** R's log-likelihood from a pass's sums (see the header). */
export function diffuseLogLik(ssq: number, sumLogF: number, nu: number, nObserved: number): number {
  const n = nObserved;
  return -0.5 * (n * Math.log(ssq / nu) + (n * sumLogF) / nu + n + n * Math.log(2 * Math.PI));
}

/** −log L at given ARMA coefficients and β (for the Hessian): the load's errors y − Xβ filtered alone. */
export function diffuseNegLogLik(d: Design, diff: readonly number[], ss: ArmaStateSpace, beta: ArrayLike<number>, observed: Uint8Array, nObserved: number): number {
  const u = Float64Array.from(d.y);
  for (let j = 0; j < d.columns.length; j++) {
    const c = d.columns[j];
    for (let t = 0; t < u.length; t++) u[t] -= c[t] * beta[j];
  }
  const pass = diffuseFilter(diffuseModel(ss, diff), [u], observed);
  let ssq = 0;
  for (const v of pass.std[0]) if (v === v) ssq += v * v;
  return -diffuseLogLik(ssq, pass.sumLogF, pass.nu, nObserved);
}
