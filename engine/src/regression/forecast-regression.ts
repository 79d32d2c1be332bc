/**
 * Forecasts of regression with ARMA errors: ŷ_{n+h} = x_{n+h}'β + û_{n+h}, the errors u = y − Xβ
 * forecast as an ARIMA — the ARMA forecasts of Δ(B)u from the filter's final state, carried back
 * through the differencing from the (filled) error history — with the error variance through
 * the ψ-weights of 1/Δ(B) (../differencing). As R's predict(arima, newxreg=), β is treated as
 * known (its estimation error is not added). The `extraVariance` hook adds a variance per step
 * for regressors that are themselves forecasts (e.g. β'Σ_x β from a temperature forecast's
 * spread), as an error independent of the load's innovations.
 */
import { forecastState } from '../arma/fit';
import { ArmaStateSpace } from '../arma/state-space';
import { extendForecast, integratedVariance } from '../series/differencing';
import { INTERCEPT } from './design';
import { DiffuseModel, predictCovariance, predictState } from './diffuse-filter';
import type { Regressor, RegressionForecast, RegressionForecastOptions } from './types';

/**
 * Standard normal quantiles for the 80 % and 95 % bands, qnorm(0.9) and qnorm(0.975) (R 4.2.2);
 * forecast.ts computes the same values to 14 digits (a test holds them so), written out because
 * this folder may not import the top level (scripts/folder-cycles.mjs).
 */
export const Z80 = 1.2815515655446004;
export const Z95 = 1.959963984540054;

/** What a forecast starts from (the end of the history the model was last run over). */
export interface ForecastState {
  ss: ArmaStateSpace;
  aEnd: Float64Array;
  PEnd: Float64Array;
  sigma2: number;
  diff: number[];
  /** y − Xβ on the load's timeline, missing hours filled by the model's predictions */
  filledErrors: Float64Array;
  /** β's names ("intercept" first when included) and values */
  names: string[];
  beta: Float64Array;
  /**
   * for the diffuse form (a differenced series with gaps): the filtered state a_{n|n}, P_{n|n}
   * of the errors' levels, forecast in that state space as R's KalmanForecast does
   */
  diffuse?: { model: DiffuseModel; a: Float64Array; P: Float64Array };
}

/** Means and variances of the errors u for h steps from the diffuse form's filtered state. */
function diffuseErrorForecast(st: NonNullable<ForecastState['diffuse']>, sigma2: number, h: number): { uMean: Float64Array; variance: Float64Array } {
  const md = st.model;
  const { m, zCols, zCoefs } = md;
  const a = Float64Array.from(st.a);
  const an = new Float64Array(m);
  const P = Float64Array.from(st.P);
  const work = new Float64Array(m * m);
  const mean = new Float64Array(h);
  const variance = new Float64Array(h);
  for (let i = 0; i < h; i++) {
    predictState(md, a, an);
    a.set(an);
    predictCovariance(md, P, work);
    let mu = 0;
    let v = 0;
    for (let k = 0; k < zCols.length; k++) {
      mu += zCoefs[k] * a[zCols[k]];
      for (let l = 0; l < zCols.length; l++) v += zCoefs[k] * P[zCols[k] * m + zCols[l]] * zCoefs[l];
    }
    mean[i] = mu;
    variance[i] = v * sigma2;
  }
  return { uMean: mean, variance };
}

/** Means and variances of the errors u for h steps: ARMA forecasts of Δ(B)u carried back through the differencing. */
function errorForecast(st: ForecastState, h: number): { uMean: Float64Array; variance: Float64Array } {
  const wf = forecastState(st.ss, st.aEnd, st.PEnd, st.sigma2, 0, h);
  const uMean = st.diff.length ? extendForecast(st.filledErrors, wf.mean, st.diff) : wf.mean;
  if (st.diff.length) return { uMean, variance: integratedVariance(wf.cov, h, st.diff) };
  const variance = new Float64Array(h);
  for (let i = 0; i < h; i++) variance[i] = wf.cov[i * h + i];
  return { uMean, variance };
}

/** The future regressor values as columns in β's order (the intercept a column of ones); strict. */
function futureColumns(st: ForecastState, future: readonly Regressor[]): { h: number; cols: Float64Array[] } {
  const expected = st.names.filter((nm) => nm !== INTERCEPT);
  const seen = new Set<string>();
  for (const r of future) {
    if (!expected.includes(r.name)) throw new Error(`forecast: regressor "${r.name}" is not in the fitted model (${expected.join(', ') || 'none'})`);
    if (seen.has(r.name)) throw new Error(`forecast: regressor "${r.name}" is given twice`);
    seen.add(r.name);
  }
  const missing = expected.filter((nm) => !seen.has(nm));
  if (missing.length) throw new Error(`forecast: future values of ${missing.map((m) => `"${m}"`).join(', ')} are needed`);
  const h = future.length ? future[0].values.length : -1;
  for (const r of future) {
    if (r.values.length !== h) throw new Error(`forecast: regressor "${r.name}" has ${r.values.length} future values, "${future[0].name}" has ${h}`);
    for (let i = 0; i < h; i++) if (!Number.isFinite(r.values[i])) throw new Error(`forecast: future value ${i + 1} of "${r.name}" is not a finite number`);
  }
  return {
    h,
    cols: st.names.map((nm) => (nm === INTERCEPT ? new Float64Array(Math.max(h, 0)).fill(1) : Float64Array.from((future.find((r) => r.name === nm) as Regressor).values))),
  };
}

/**
 * h-step forecasts given the regressors' future values (h = their length). A model without
 * regressors takes `{ horizon }` in place of the empty list's length.
 */
export function forecastFromState(st: ForecastState, future: readonly Regressor[], opts: RegressionForecastOptions = {}): RegressionForecast {
  const fc = futureColumns(st, future);
  const h = fc.h >= 0 ? fc.h : (opts.horizon ?? -1);
  if (!(Number.isInteger(h) && h >= 1)) throw new Error('forecast: the horizon must be at least one hour (give the regressors\' future values, or `horizon` for a model without regressors)');
  if (fc.h >= 0 && opts.horizon !== undefined && opts.horizon !== h) throw new Error(`forecast: horizon ${opts.horizon} differs from the ${h} future regressor values`);
  const extra = opts.extraVariance;
  if (extra !== undefined) {
    if (extra.length !== h) throw new Error(`forecast: extraVariance has ${extra.length} values for ${h} steps`);
    for (let i = 0; i < h; i++) if (!(extra[i] >= 0) || !Number.isFinite(extra[i])) throw new Error(`forecast: extraVariance ${i + 1} must be a finite variance ≥ 0, got ${extra[i]}`);
  }
  const { uMean, variance } = st.diffuse ? diffuseErrorForecast(st.diffuse, st.sigma2, h) : errorForecast(st, h);
  const out: RegressionForecast = { mean: [], se: [], lower80: [], upper80: [], lower95: [], upper95: [], regression: [], modelSe: [] };
  for (let i = 0; i < h; i++) {
    let xb = 0;
    for (let j = 0; j < fc.cols.length; j++) xb += fc.cols[j][i] * st.beta[j];
    const m = xb + uMean[i];
    const v = Math.max(variance[i], 0);
    const se = Math.sqrt(v + (extra ? extra[i] : 0));
    out.regression.push(xb);
    out.modelSe.push(Math.sqrt(v));
    out.mean.push(m);
    out.se.push(se);
    out.lower80.push(m - Z80 * se);
    out.upper80.push(m + Z80 * se);
    out.lower95.push(m - Z95 * se);
    out.upper95.push(m + Z95 * se);
  }
  return out;
}
