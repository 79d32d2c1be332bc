/**
 * The automatic forecasting pipeline for one zone, as the desk runs it:
 *  1. hours marked as outage / bad data become missing;
 *  2. the differencing is chosen among (1−B^24), (1−B^168) and (1−B^24)(1−B^168) by a short
 *     rolling-origin backtest on the last days of the history (Tashman 2000), because which one
 *     serves a zone best is an empirical question;
 *  3. for each candidate differencing the ARMA orders p, q ≤ 3 are chosen by AICc on the
 *     history before the test days, and the model is scored on the test days with its
 *     coefficients held fixed (only the Kalman filter runs over the new hours);
 *  4. the winner is refitted on the whole history (exact ML, standard errors), checked
 *     (Ljung–Box at lags 24 and 48, residual ACF) and used to forecast with 80 % / 95 % intervals.
 * Non-seasonal ARMA on the seasonally differenced series keeps the state small (r ≤ 4) and the
 * filter fast; a seasonal block can be asked for explicitly through `fixed`.
 * The forecast is never NaN and never negative: values are floored at 0 MW, and when the model
 * cannot be fitted, produces a non-finite value, or loses to the weekly seasonal-naive forecast
 * on the test days, the pipeline returns the seasonal-naive forecast and says why.
 */
import { acf, acfBand } from './series/acf';
import { describeDifferencing, differenceOrder } from './differencing';
import { applyArima, ArimaFit, fitArima, forecastArima, IntervalForecast } from './forecast';
import { ljungBox, LjungBoxResult } from './ljung-box';
import { accuracy } from './metrics';
import { seasonalNaive } from './seasonal-naive';
import { Criterion, selectOrder } from './select';
import { countFinite, SeriesInput, withExcluded } from './series/series';
import { difference } from './differencing';
import { Coefficient, type ArmaSpec } from './arma/fit';

export const DEFAULT_CANDIDATES: number[][] = [[24], [168], [24, 168]];

/** A model the pipeline may choose: the differencing lags and the ARMA on what they leave. */
export interface ModelChoice extends ArmaSpec {
  diff: number[];
  /** starting values (natural parameters) for the final fit */
  start?: { ar?: ArrayLike<number>; ma?: ArrayLike<number>; sar?: ArrayLike<number>; sma?: ArrayLike<number> };
}

export interface PipelineOptions {
  /** differencing candidates (default (1−B^24), (1−B^168), (1−B^24)(1−B^168)) */
  candidates?: number[][];
  maxP?: number;
  maxQ?: number;
  criterion?: Criterion;
  /** days at the end of the history used to choose the differencing (default 7) */
  selectionDays?: number;
  /** skip all selection and fit this model (the hourly update with fixed orders) */
  fixed?: ModelChoice;
  /** exact-ML fits per differencing after the Hannan–Rissanen screening (default 4; 0 = all) */
  screen?: number;
  /** standard errors of the final fit (default true; a backtest that only scores forecasts
   *  skips the Hessian) */
  computeSe?: boolean;
  /** hide the model if it loses to seasonal naive on the selection days (default true) */
  requireBeatBaseline?: boolean;
}

export interface PipelineInput {
  /** hourly load in MW, oldest first, NaN (or null-ish) for a missing hour; the forecast starts
   *  at the hour after the last element */
  history: SeriesInput;
  /** indices into `history` of hours marked as outage or bad data */
  excluded?: Iterable<number>;
  /** number of hours to forecast */
  horizon: number;
  options?: PipelineOptions;
}

export interface CandidateResult {
  diff: number[];
  label: string;
  p: number;
  q: number;
  aicc: number;
  /** mean MAPE (%) of the day-ahead forecasts on the selection days */
  mape: number;
  error?: string;
}

export interface ModelSummary {
  diff: number[];
  label: string;
  p: number;
  q: number;
  P: number;
  Q: number;
  period: number;
  includeMean: boolean;
  coefficients: Coefficient[];
  sigma2: number;
  loglik: number;
  aic: number;
  aicc: number;
  bic: number;
  nUsed: number;
  ljungBox: LjungBoxResult[];
  residualAcf: number[];
  residualAcfBand: number;
  fitMs: number;
  filledHours: number;
}

export interface PipelineResult {
  method: 'arima' | 'seasonal-naive';
  /** why the seasonal-naive forecast was used instead of the model */
  fallbackReason?: string;
  /** the model fitted (present also when it lost to the baseline, for the workbench) */
  model?: ModelSummary;
  forecast: IntervalForecast;
  candidates: CandidateResult[];
  /** MAPE (%) of seasonal naive on the selection days */
  baselineMape: number;
  timings: { totalMs: number; selectionMs: number; fitMs: number };
  warnings: string[];
}

const MIN_HOURS = 3 * 168;

export function runPipeline(input: PipelineInput): PipelineResult {
  const t0 = performance.now();
  const h = Math.max(1, Math.floor(input.horizon));
  const o = input.options ?? {};
  const y = withExcluded(input.history, input.excluded);
  const warnings: string[] = [];
  const candidates: CandidateResult[] = [];
  let baselineMape = NaN;
  let selectionMs = 0;
  const naive = (reason: string, model?: ModelSummary, fitMs = 0): PipelineResult => ({
    method: 'seasonal-naive',
    fallbackReason: reason,
    model,
    forecast: floorAtZero(seasonalNaive(y, h)),
    candidates,
    baselineMape,
    timings: { totalMs: performance.now() - t0, selectionMs, fitMs },
    warnings,
  });
  const nFinite = countFinite(y);
  if (nFinite < MIN_HOURS) return naive(`only ${nFinite} hours of usable history; the model needs at least ${MIN_HOURS}`);
  if (nFinite < 0.7 * y.length) warnings.push(`${y.length - nFinite} of ${y.length} hours are missing or excluded`);

  let choice: ModelChoice;
  try {
    if (o.fixed) choice = o.fixed;
    else {
      const ts = performance.now();
      choice = chooseModel(y, h, o, candidates, warnings, (m) => (baselineMape = m));
      selectionMs = performance.now() - ts;
    }
  } catch (e) {
    return naive(`model selection failed: ${(e as Error).message}`);
  }

  let fit: ArimaFit;
  try {
    const { start, ...spec } = choice;
    fit = fitArima(y, { ...spec, includeMean: choice.includeMean ?? false }, { start, computeSe: o.computeSe ?? true });
  } catch (e) {
    return naive(`the ARMA fit failed: ${(e as Error).message}`);
  }
  const model = summarize(fit);
  const fc = forecastArima(fit, h);
  if (!fc.mean.every(Number.isFinite) || !fc.se.every(Number.isFinite)) return naive('the model produced a non-finite forecast', model, model.fitMs);
  if (!fit.arma.converged) warnings.push('the optimiser stopped before full convergence');
  const lbBad = model.ljungBox.find((l) => l.pValue < 0.01);
  if (lbBad) warnings.push(`residuals still correlated (Ljung–Box lag ${lbBad.lag}, p = ${lbBad.pValue.toPrecision(2)})`);
  const chosen = candidates.find((c) => sameLags(c.diff, choice.diff));
  if ((o.requireBeatBaseline ?? true) && chosen && Number.isFinite(baselineMape) && chosen.mape > baselineMape) {
    return naive(`the model (MAPE ${chosen.mape.toFixed(2)} %) did not beat seasonal naive (${baselineMape.toFixed(2)} %) on the last ${o.selectionDays ?? 7} days`, model, model.fitMs);
  }
  return {
    method: 'arima',
    model,
    forecast: floorAtZero(fc),
    candidates,
    baselineMape,
    timings: { totalMs: performance.now() - t0, selectionMs, fitMs: model.fitMs },
    warnings,
  };
}

function chooseModel(
  y: Float64Array,
  h: number,
  o: PipelineOptions,
  out: CandidateResult[],
  warnings: string[],
  setBaseline: (m: number) => void,
): ModelChoice {
  const cands = o.candidates ?? DEFAULT_CANDIDATES;
  const n = y.length;
  const lead = Math.max(0, h - 24);
  const maxD = Math.max(...cands.map(differenceOrder));
  let days = o.selectionDays ?? 7;
  while (days > 1 && n - days * 24 - lead - maxD < MIN_HOURS - 168) days--;
  const testStart = n - days * 24;
  const trainEnd = testStart - lead;
  const train = y.subarray(0, trainEnd);
  // baseline on the same days
  let baseSum = 0;
  let baseN = 0;
  for (let d = 0; d < days; d++) {
    const ws = testStart + d * 24;
    const origin = ws - lead;
    const f = seasonalNaive(y.subarray(0, origin), lead + 24);
    const m = accuracy(y.subarray(ws, ws + 24), { mean: f.mean.slice(lead) }).mape;
    if (Number.isFinite(m)) {
      baseSum += m;
      baseN++;
    }
  }
  setBaseline(baseN ? baseSum / baseN : NaN);
  let best: { choice: ModelChoice; mape: number } | null = null;
  for (const diff of cands) {
    const label = describeDifferencing(diff);
    try {
      if (train.length - differenceOrder(diff) < 168) throw new Error('history too short for this differencing');
      const w = difference(train, diff);
      const sel = selectOrder(w, {
        maxP: o.maxP ?? 3,
        maxQ: o.maxQ ?? 3,
        criterion: o.criterion ?? 'aicc',
        includeMean: false,
        computeSe: false,
        screen: o.screen ?? 4,
        maxIter: 80,
        fTol: 1e-9,
      });
      const base: ArimaFit = { diff, arma: sel.best, filled: new Float64Array(0), filledCount: 0 };
      let sum = 0;
      let cnt = 0;
      for (let d = 0; d < days; d++) {
        const ws = testStart + d * 24;
        const origin = ws - lead;
        const f = forecastArima(applyArima(base, y.subarray(0, origin)), lead + 24);
        const m = accuracy(y.subarray(ws, ws + 24), { mean: f.mean.slice(lead) }).mape;
        if (Number.isFinite(m)) {
          sum += m;
          cnt++;
        }
      }
      const mape = cnt ? sum / cnt : NaN;
      out.push({ diff, label, p: sel.best.spec.p, q: sel.best.spec.q, aicc: sel.best.aicc, mape });
      if (Number.isFinite(mape) && (!best || mape < best.mape)) {
        best = { choice: { diff, p: sel.best.spec.p, q: sel.best.spec.q, start: { ar: sel.best.ar, ma: sel.best.ma } }, mape };
      }
    } catch (e) {
      out.push({ diff, label, p: NaN, q: NaN, aicc: NaN, mape: NaN, error: (e as Error).message });
      warnings.push(`${label}: ${(e as Error).message}`);
    }
  }
  if (!best) throw new Error('no differencing candidate could be fitted');
  return best.choice;
}

function summarize(fit: ArimaFit): ModelSummary {
  const a = fit.arma;
  const s = a.spec;
  const fitdf = s.p + s.q + s.P + s.Q;
  const res = a.residuals;
  const racf = acf(res, 48);
  return {
    diff: fit.diff,
    label: describeDifferencing(fit.diff),
    p: s.p,
    q: s.q,
    P: s.P,
    Q: s.Q,
    period: s.period,
    includeMean: s.includeMean,
    coefficients: a.coefficients,
    sigma2: a.sigma2,
    loglik: a.loglik,
    aic: a.aic,
    aicc: a.aicc,
    bic: a.bic,
    nUsed: a.nUsed,
    ljungBox: [ljungBox(res, 24, fitdf), ljungBox(res, 48, fitdf)],
    residualAcf: Array.from(racf.subarray(1)),
    residualAcfBand: acfBand(countFinite(res)),
    fitMs: a.fitMs,
    filledHours: fit.filledCount,
  };
}

/** Floor a forecast and its bands at 0 MW (load is never negative). */
export function floorAtZero(f: IntervalForecast): IntervalForecast {
  const z = (v: number[]) => v.map((x) => (Number.isFinite(x) ? Math.max(0, x) : 0));
  return { mean: z(f.mean), se: f.se.map((x) => (Number.isFinite(x) ? x : 0)), lower80: z(f.lower80), upper80: z(f.upper80), lower95: z(f.lower95), upper95: z(f.upper95) };
}

function sameLags(a: number[], b: number[]): boolean {
  return a.length === b.length && a.every((v, i) => v === b[i]);
}
