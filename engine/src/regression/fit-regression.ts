/**
 * Estimator of regression with ARMA errors (see types.ts).
 */
import type { Regressor, RegressionFit, RegressionFitOptions, RegressionSpec } from './types';

/**
 * Fit y_t = x_t'β + u_t with Δ(B)u_t ARMA by exact Gaussian maximum likelihood. `y` is hourly
 * load (NaN = missing), `regressors` the named columns on the same timeline (may be empty).
 */
export function fitRegression(y: ArrayLike<number>, regressors: readonly Regressor[], spec: RegressionSpec, opts: RegressionFitOptions = {}): RegressionFit {
  void y;
  void regressors;
  void spec;
  void opts;
  throw new Error('fitRegression: not yet');
}

/**
 * The fitted model (β, ARMA coefficients, σ²) run over another history — typically the one it
 * was fitted on extended by new hours — without re-estimating: the errors y − Xβ are filtered
 * again, so the forecast starts after the last hour of `y`. Used for issue-time forecasts and
 * backtests with fixed coefficients.
 */
export function applyRegression(fit: RegressionFit, y: ArrayLike<number>, regressors: readonly Regressor[]): RegressionFit {
  void fit;
  void y;
  void regressors;
  throw new Error('applyRegression: not yet');
}
