/**
 * Estimator of regression with ARMA errors (see types.ts), by exact maximum likelihood:
 *  - the same differencing applied to the load and to every regressor (design.ts), as R's
 *    arima(x, order, seasonal, xreg=) does; hours where the load or a regressor is missing are
 *    skipped by the Kalman filter (predicted through, not updated),
 *  - β and σ² concentrated out by GLS through the Kalman filter (profile.ts; Harvey 1989,
 *    §3.4.2; Durbin & Koopman 2012, §6.2), the ARMA coefficients searched by BFGS over the
 *    partial-autocorrelation transform that keeps them stationary / invertible (Jones 1980;
 *    Monahan 1984), started from Hannan–Rissanen on the OLS residuals (Hannan & Rissanen 1982),
 *    with the extra starts of the plain ARMA fit (all-zero and conditional sum of squares) for
 *    AR and MA orders both ≥ 2 and for a search that ends on the boundary,
 *  - standard errors of β and of the ARMA coefficients together from the inverse of the
 *    Hessian of the full −log L (σ² concentrated, β free), as R's arima reports var.coef
 *    (hessian.ts),
 *  - AIC = −2 log L + 2k, AICc = AIC + 2k(k+1)/(n* − k − 1), BIC = AIC + k(log n* − 2) with k the
 *    ARMA and regression coefficients + 1 (σ²) and n* the observed hours between the first and
 *    the last observed one less the differencing's degree: R's forecast package's count
 *    (forecast::Arima; Hyndman & Khandakar 2008); Akaike 1974, Hurvich & Tsai 1989, Schwarz 1978.
 * Why concentrated rather than joint: for fixed ARMA coefficients the likelihood is exactly
 * quadratic in β, so β̂ costs one least-squares solve, the search has only the ARMA dimensions
 * and no scaling problem between a coefficient of 0.5 and an intercept in the tens of
 * thousands, and the maximum reached is the joint one (the profile likelihood has the same
 * maximiser).
 */
import { minimizeBfgs, BfgsResult } from '../arma/bfgs';
import { cssStart } from '../arma/css';
import { fromUnconstrained, normalizeSpec, onBoundary, needsSecondStart, splitNatural, stateSpaceOf, toUnconstrained, ArmaSpec, Coefficient, Natural } from '../arma/fit';
import { hannanRissanen } from '../arma/hannan-rissanen';
import { differenceOrder } from '../series/differencing';
import { buildDesign, INTERCEPT } from './design';
import { forecastFromState } from './forecast-regression';
import { Covariance, hessianStandardErrors } from './hessian';
import { crossProducts, solveNormal } from './least-squares';
import { chooseForm, differencedForm, diffuseForm, LikelihoodForm } from './likelihood-forms';
import { differencedErrors } from './profile';
import type { Regressor, RegressionFit, RegressionFitOptions, RegressionSpec } from './types';

function armaNames(o: Required<ArmaSpec>): string[] {
  const names: string[] = [];
  for (let i = 1; i <= o.p; i++) names.push(`ar${i}`);
  for (let i = 1; i <= o.q; i++) names.push(`ma${i}`);
  for (let i = 1; i <= o.P; i++) names.push(`sar${i}`);
  for (let i = 1; i <= o.Q; i++) names.push(`sma${i}`);
  return names;
}

/**
 * n* of forecast::Arima: the observed hours (those between the first observed and the last, which
 * is all of them) less the differencing's degree.
 */
function effectiveLength(y: Float64Array, degree: number): number {
  let count = 0;
  for (let t = 0; t < y.length; t++) if (y[t] === y[t]) count++;
  return count - degree;
}

export function fitRegression(y: ArrayLike<number>, regressors: readonly Regressor[], spec: RegressionSpec, opts: RegressionFitOptions = {}): RegressionFit {
  const t0 = performance.now();
  const diff = [...(spec.diff ?? [])];
  const includeMean = spec.includeMean ?? diff.length === 0;
  if (includeMean && diff.length > 0) throw new Error('a constant vanishes after differencing: fit without the intercept (includeMean false), as R does for a differenced model');
  const o = normalizeSpec({ ...spec, includeMean });
  const design = buildDesign(y, regressors, diff, includeMean);
  const k = o.p + o.q + o.P + o.Q;
  const nBeta = design.names.length;
  let observed = 0;
  for (let t = 0; t < design.w.length; t++) if (design.w[t] === design.w[t]) observed++;
  if (observed < k + nBeta + 3) throw new Error(`too few observed hours after the differencing (${observed}) for ${k + nBeta} coefficients`);
  const s = o.period;
  // the ARMA state's size, for the choice of the likelihood's form
  const r = Math.max(o.p + o.P * s, o.q + o.Q * s + 1, 1);
  const form = chooseForm(design, diff, r);

  // starting values: OLS of the differenced load on the differenced regressors, then
  // Hannan–Rissanen on its residuals (or the start given)
  let olsErrors = design.w;
  if (nBeta > 0) {
    const cp = crossProducts(design.wColumns, design.w);
    olsErrors = differencedErrors(design, solveNormal(cp.XtX, cp.Xty, design.names).beta);
  }
  const orders = { p: o.p, q: o.q, P: o.P, Q: o.Q, period: s || 1 };
  const st = opts.start;
  const hr = hannanRissanen(olsErrors, orders);
  const startNat: Natural = {
    ar: st?.ar ? Float64Array.from(st.ar) : hr.ar,
    ma: st?.ma ? Float64Array.from(st.ma) : hr.ma,
    sar: st?.sar ? Float64Array.from(st.sar) : hr.sar,
    sma: st?.sma ? Float64Array.from(st.sma) : hr.sma,
  };
  const u0 = toUnconstrained(startNat) ?? new Float64Array(k);

  const objective = (u: Float64Array): number => {
    try {
      return form.objective(stateSpaceOf(fromUnconstrained(u, o), s));
    } catch {
      // a root on the unit circle to machine precision: no stationary covariance, no likelihood
      return Infinity;
    }
  };
  const search = (from: Float64Array): BfgsResult => minimizeBfgs(objective, from, { maxIter: opts.maxIter ?? 200, gradTol: 1e-7, fTol: opts.fTol ?? 1e-13, step: 1e-6 });
  // fail early and by name when a regressor is collinear (the objective would only say Infinity)
  form.estimate(stateSpaceOf(fromUnconstrained(u0, o), s));
  let opt = search(u0);
  const tried: Float64Array[] = [];
  const tryFrom = (from: Float64Array | null): void => {
    if (!from) return;
    tried.push(from);
    const other = search(from);
    if (other.f < opt.f - 1e-9) opt = other;
  };
  const css = (): Float64Array | null => cssStart(olsErrors, orders);
  if (!st && needsSecondStart(o)) {
    // several maxima are common when AR and MA roots nearly cancel (see arma/fit.ts)
    tryFrom(new Float64Array(k));
    tryFrom(css());
  }
  if (onBoundary(opt.x) && tried.length === 0) {
    tryFrom(css());
    tryFrom(new Float64Array(k));
  }

  const nat = fromUnconstrained(opt.x, o);
  const ss = stateSpaceOf(nat, s);
  const est = form.estimate(ss);
  const { sigma2, loglik } = est;
  const nParams = k + nBeta + 1;
  const nStar = effectiveLength(design.y, differenceOrder(diff));
  const aic = -2 * loglik + 2 * nParams;
  const aicc = nStar - nParams - 1 > 0 ? aic + (2 * nParams * (nParams + 1)) / (nStar - nParams - 1) : Infinity;
  const bic = aic + nParams * (Math.log(nStar) - 2);

  const armaValues = [...nat.ar, ...nat.ma, ...nat.sar, ...nat.sma];
  const m = k + nBeta;
  const { se, cov } = (opts.computeSe ?? true) ? standardErrors(form, o, armaValues, est.beta, sigma2, est.inverse) : { se: new Array<number>(m).fill(NaN), cov: new Float64Array(m * m).fill(NaN) };
  const armaCoefficients: Coefficient[] = armaNames(o).map((name, i) => ({ name, value: armaValues[i], se: se[i] }));
  const beta: Coefficient[] = design.names.map((name, j) => ({ name, value: est.beta[j], se: se[k + j] }));

  const state = form.state(ss, est.beta, sigma2);
  const fit: RegressionFit = {
    spec: o,
    diff,
    regressorNames: regressors.map((r) => r.name),
    beta,
    armaCoefficients,
    coefficients: [...armaCoefficients, ...beta],
    covariance: cov,
    ar: nat.ar,
    ma: nat.ma,
    sar: nat.sar,
    sma: nat.sma,
    sigma2,
    loglik,
    aic,
    aicc,
    bic,
    nParams,
    nUsed: est.nUsed,
    likelihood: form.kind,
    hours: design.y.length,
    errors: state.errors,
    residuals: state.residuals,
    converged: opt.converged,
    iterations: opt.iterations,
    fitMs: 0,
    forecast: (future, fopts) => forecastFromState(state.forecast, future, fopts),
  };
  fit.fitMs = performance.now() - t0;
  return fit;
}

/**
 * Standard errors of the ARMA coefficients and β together (hessian.ts): steps of 1e-4 for the
 * ARMA coefficients and 1e-3 of β_j's GLS standard error for fixed ARMA coefficients.
 */
function standardErrors(form: LikelihoodForm, o: Required<ArmaSpec>, armaValues: number[], beta: Float64Array, sigma2: number, glsInverse: Float64Array): Covariance {
  const ka = armaValues.length;
  const kb = beta.length;
  const steps = [...armaValues.map(() => 1e-4), ...Array.from(beta, (_, j) => 1e-3 * Math.sqrt(sigma2 * glsInverse[j * kb + j]) || 1e-6)];
  return hessianStandardErrors([...armaValues, ...beta], steps, (v) => form.negLogLik(stateSpaceOf(splitNatural(v, o), o.period), v.slice(ka)));
}

/**
 * The fitted model (β, ARMA coefficients, σ²) run over another history — typically the one it
 * was fitted on extended by new hours — without re-estimating: the errors y − Xβ are filtered
 * again, so the forecast starts after the last hour of `y`. Used for issue-time forecasts and
 * backtests with fixed coefficients. The estimation figures (log L, criteria, standard errors)
 * stay those of the fit.
 */
export function applyRegression(fit: RegressionFit, y: ArrayLike<number>, regressors: readonly Regressor[]): RegressionFit {
  const given = new Set(regressors.map((r) => r.name));
  const missing = fit.regressorNames.filter((nm) => !given.has(nm));
  if (missing.length) throw new Error(`apply: regressor${missing.length > 1 ? 's' : ''} ${missing.map((m) => `"${m}"`).join(', ')} of the fitted model not given`);
  const extra = regressors.filter((r) => !fit.regressorNames.includes(r.name));
  if (extra.length) throw new Error(`apply: regressor "${extra[0].name}" is not in the fitted model (${fit.regressorNames.join(', ') || 'none'})`);
  const ordered = fit.regressorNames.map((nm) => regressors.find((r) => r.name === nm) as Regressor);
  const includeMean = fit.beta.length > 0 && fit.beta[0].name === INTERCEPT;
  const design = buildDesign(y, ordered, fit.diff, includeMean);
  const beta = Float64Array.from(fit.beta, (b) => b.value);
  const ss = stateSpaceOf(fit, fit.spec.period);
  // the form the model was estimated in, when the new history still allows it
  const form = fit.likelihood === 'diffuse' ? diffuseForm(design, fit.diff) : differencedForm(design, fit.diff);
  const state = form.state(ss, beta, fit.sigma2);
  return {
    ...fit,
    hours: design.y.length,
    errors: state.errors,
    residuals: state.residuals,
    forecast: (future, fopts) => forecastFromState(state.forecast, future, fopts),
  };
}
