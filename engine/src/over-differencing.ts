/**
 * The sign of a difference too many in a fitted model: a moving-average root on the unit circle.
 * Differencing a series that is already stationary multiplies its MA part by the factor removed,
 * (1 − B) for one difference too many, which has its root at 1 (Box & Jenkins 1970, §4.1;
 * Plosser & Schwert 1977, "Estimation of a non-invertible moving average process: the case of
 * overdifferencing", Journal of Econometrics 6). Exact maximum likelihood then puts the MA
 * estimate on the unit circle with positive probability (the pile-up of Davis & Dunsmuir 1996), and
 * the model, in effect the less-differenced one, forecasts the day ahead as well as it by chance.
 * Such an order is not what its differencing claims, so the pipeline leaves it out of its choice.
 */
import { arToPacf } from './arma/transform';
import type { ArmaFit } from './arma/fit';

/** Partial autocorrelations of an MA polynomial within this distance of ±1 count as a unit root. */
export const MA_UNIT_ROOT_MARGIN = 0.01;

/**
 * Whether the MA polynomial 1 + Σ θ_k B^k has a root on (or within the margin of) the unit
 * circle: some partial autocorrelation of −θ (the step-down recursion, ./arma/transform) at
 * least 1 − margin in size, or none because it is not invertible.
 */
export function hasMaUnitRoot(theta: ArrayLike<number>, margin = MA_UNIT_ROOT_MARGIN): boolean {
  if (theta.length === 0) return false;
  const u = arToPacf(Array.from(theta, (v) => -v));
  return u === null || u.some((v) => Math.abs(v) >= 1 - margin);
}

/** A fitted model whose non-seasonal or seasonal MA part has a unit root (see hasMaUnitRoot). */
export function overDifferenced(fit: Pick<ArmaFit, 'ma' | 'sma'>): boolean {
  return hasMaUnitRoot(fit.ma) || hasMaUnitRoot(fit.sma);
}
