/**
 * ARIMA-type models for load: a differencing Δ(B) = Π(1 − B^s) followed by an ARMA on the
 * differenced series (Box & Jenkins 1970), and h-step forecasts with 80 % and 95 % prediction
 * intervals back on the original scale (MW).
 *
 * Forecast errors of the differenced series come from the Kalman filter's final state (their
 * joint covariance, not only the variances) and are carried through the differencing with the
 * ψ-weights of 1/Δ(B) (see ./differencing). Where a past load value the inversion needs is
 * missing (a gap or an excluded outage hour), it is replaced by the model's own one-step
 * prediction of it (the Kalman filter's prediction of the differenced value, turned back into
 * load), so an outage dip never comes back through the seasonal lags.
 */
import { difference, extendForecast, integratedVariance } from './differencing';
import { fillHistory } from './series/fill-history';
import type { IntervalForecast } from './series/interval-forecast';
import { applyArma, ArmaFit, ArmaSpec, fitArma, FitOptions } from './arma/fit';
import { normalQuantile } from './distributions';

export interface ArimaSpec extends ArmaSpec {
  /** differencing lags, e.g. [24, 168]; [] for none */
  diff: number[];
}

export interface ArimaFit {
  diff: number[];
  arma: ArmaFit;
  /** the history with missing hours replaced by the model's predictions (used for inversion) */
  filled: Float64Array;
  /** number of hours filled in */
  filledCount: number;
}

export type { IntervalForecast };

export { fillHistory };

export const Z80 = normalQuantile(0.9);
export const Z95 = normalQuantile(0.975);

/** Fit Δ(B) then ARMA; the mean is included by default only when there is no differencing. */
export function fitArima(y: ArrayLike<number>, spec: ArimaSpec, opts: FitOptions = {}): ArimaFit {
  const diff = spec.diff ?? [];
  const w = difference(y, diff);
  const arma = fitArma(w, { ...spec, includeMean: spec.includeMean ?? diff.length === 0 }, opts);
  const { filled, count } = fillHistory(y, diff, arma.predictions);
  return { diff, arma, filled, filledCount: count };
}

/** Run an estimated model over a (longer) load history without re-estimating it. */
export function applyArima(fit: ArimaFit, y: ArrayLike<number>): ArimaFit {
  const w = difference(y, fit.diff);
  const arma = applyArma(fit.arma, w);
  const { filled, count } = fillHistory(y, fit.diff, arma.predictions);
  return { diff: fit.diff, arma, filled, filledCount: count };
}

/** h-step forecasts of the load with standard errors and 80 % / 95 % intervals. */
export function forecastArima(fit: ArimaFit, h: number): IntervalForecast {
  const wf = fit.arma.forecast(h);
  const mean = fit.diff.length ? extendForecast(fit.filled, wf.mean, fit.diff) : wf.mean;
  let variance: Float64Array;
  if (fit.diff.length) variance = integratedVariance(wf.cov, h, fit.diff);
  else {
    variance = new Float64Array(h);
    for (let i = 0; i < h; i++) variance[i] = wf.cov[i * h + i];
  }
  const out: IntervalForecast = { mean: [], se: [], lower80: [], upper80: [], lower95: [], upper95: [] };
  for (let i = 0; i < h; i++) {
    const m = mean[i];
    const se = Math.sqrt(Math.max(variance[i], 0));
    out.mean.push(m);
    out.se.push(se);
    out.lower80.push(m - Z80 * se);
    out.upper80.push(m + Z80 * se);
    out.lower95.push(m - Z95 * se);
    out.upper95.push(m + Z95 * se);
  }
  return out;
}
