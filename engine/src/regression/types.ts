/**
 * Regression with ARMA errors (Harvey 1989, §3.4 and §7.4; Durbin & Koopman 2012, §6.2):
 *   y_t = x_t'β + u_t,   Δ(B) u_t an ARMA(p, q)×(P, Q)_s,
 * with the same differencing Δ(B) = Π(1 − B^s) applied to the load and to every regressor, as
 * R's arima(x, order, seasonal, xreg=) does (R 4.2.2, stats). The types of the estimator
 * (fit-regression.ts) and of its forecasts (forecast-regression.ts).
 */
import type { ArmaSpec, Coefficient } from '../arma/fit';
import type { IntervalForecast } from '../series/interval-forecast';

/** One named regressor column, hour by hour on the same timeline as the load. */
export interface Regressor {
  /** its name in the coefficient table (unique; "intercept" is reserved) */
  name: string;
  /**
   * one value per hour; NaN makes that hour missing for the fit (as R's arima treats an NA in
   * xreg), never in future values given to a forecast
   */
  values: ArrayLike<number>;
}

/**
 * The differencing and the ARMA order, as for fitArima: `diff` the differencing lags ([] for
 * none, [24] daily, [1, 12] R's d = 1 and D = 1 with period 12), p, q and an optional seasonal
 * block P, Q, period. `includeMean` adds an intercept column (default: only when there is no
 * differencing, as R does; after a differencing a constant vanishes and is refused).
 */
export interface RegressionSpec extends ArmaSpec {
  /** differencing lags, e.g. [24, 168]; [] for none */
  diff: number[];
}

export interface RegressionFitOptions {
  /** standard errors from the Hessian of the full likelihood (default true) */
  computeSe?: boolean;
  /** BFGS iterations per start (default 200) */
  maxIter?: number;
  /** starting ARMA coefficients in the natural parameters (β needs none: it is concentrated out) */
  start?: { ar?: ArrayLike<number>; ma?: ArrayLike<number>; sar?: ArrayLike<number>; sma?: ArrayLike<number> };
  /** relative change of −log L / n that stops the search (default 1e-13) */
  fTol?: number;
}

export interface RegressionFit {
  spec: Required<ArmaSpec>;
  diff: number[];
  /** names of the regressor columns as given (without the intercept) */
  regressorNames: string[];
  /** regression coefficients with standard errors: "intercept" first when included, then the regressors in the order given */
  beta: Coefficient[];
  /** ARMA coefficients with standard errors: ar1.., ma1.., sar1.., sma1.. */
  armaCoefficients: Coefficient[];
  /** every coefficient in R's order: ARMA first, then intercept and regressors */
  coefficients: Coefficient[];
  /**
   * their joint covariance (R's var.coef), row-major in the order of `coefficients`; the block of
   * β gives the uncertainty of a combination such as a temperature response. NaN without
   * standard errors (computeSe false).
   */
  covariance: Float64Array;
  ar: Float64Array;
  ma: Float64Array;
  sar: Float64Array;
  sma: Float64Array;
  /** ML innovation variance Σ v²/F / n (R's sigma2) */
  sigma2: number;
  /** exact Gaussian log-likelihood of the differenced series */
  loglik: number;
  aic: number;
  aicc: number;
  bic: number;
  /** parameters counted in the criteria: ARMA coefficients + regression coefficients + 1 (σ²), as R's forecast package */
  nParams: number;
  /** hours in the likelihood: observed differenced values (R's n.used under the diffuse form) */
  nUsed: number;
  /**
   * the likelihood's form: 'differenced' (the exact likelihood of the differenced data) or
   * 'diffuse' (a differenced series with gaps, in the state space of the undifferenced errors
   * with a diffuse start, as R's arima: it keeps what differencing loses at a gap); see
   * likelihood-forms.ts
   */
  likelihood: 'differenced' | 'diffuse';
  /** hours of the load given (the timeline of y and of every regressor) */
  hours: number;
  /** regression errors u_t = y_t − x_t'β on the load's timeline (NaN where y or a regressor is missing) */
  errors: Float64Array;
  /** standardized one-step innovations of the differenced errors, on the load's timeline (NaN for the first D hours and where missing) */
  residuals: Float64Array;
  converged: boolean;
  /** BFGS iterations of the search kept */
  iterations: number;
  /** wall time of the estimation, ms */
  fitMs: number;
  /**
   * Forecasts of the load for the hours after the last hour of y, given the regressors' values
   * for those hours (one Regressor per fitted name, each of the horizon's length; in any order).
   * Throws on a missing, unknown or repeated name, unequal lengths or a non-finite value.
   */
  forecast(future: readonly Regressor[], opts?: RegressionForecastOptions): RegressionForecast;
}

export interface RegressionForecastOptions {
  /**
   * Variance added to each step's forecast-error variance (MW², one per step): the hook for
   * uncertain regressors, e.g. β'Σ_x,t β from a temperature forecast's spread. Added to the
   * ARMA error variance as an independent error (the regressor's forecast error is taken to be
   * independent of the load's innovations).
   */
  extraVariance?: ArrayLike<number>;
  /** the number of steps, needed only by a model without regressors (otherwise the future values' length) */
  horizon?: number;
}

/**
 * Load forecasts with standard errors and 80 % / 95 % intervals; the mean and `modelSe` are R's
 * predict(fit, newxreg=) pred and se, `se` includes the extra variance.
 */
export interface RegressionForecast extends IntervalForecast {
  /** the regression part x'β per step */
  regression: number[];
  /** the standard error without the extra variance (R's predict se) */
  modelSe: number[];
}
