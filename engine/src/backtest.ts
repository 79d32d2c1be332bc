/**
 * Rolling-origin day-ahead backtest (Tashman 2000): for each of the last N operating days, take
 * the history up to the forecast issue time only, refit (or update) the model, forecast the
 * whole target day and score it; the weekly seasonal-naive forecast issued at the same time is
 * scored beside it. Metrics as in ./metrics; the summary averages the daily MAPE, MAE, bias and
 * peak-hour error, takes RMSE over all hours and coverage over all hours.
 *
 * Origins: by default each target day starts at a multiple of 24 hours from index 0 and the
 * forecast is issued at its start (horizon = the day's hours). With `issueHour` H the forecast is
 * issued H hours after the start of the day before (e.g. 9 → 09:00 the day before), so the
 * horizons run from 24 − H + 1 to 48 − H hours. `dayStarts` gives explicit day boundaries
 * (23- and 25-hour operating days at daylight-saving changes), and `origins` an explicit issue
 * time for each of them (a gate closure in local time, which moves against the hours at those
 * changes).
 */
import { accuracy, Accuracy } from './metrics';
import { IntervalForecast } from './forecast';
import { ModelChoice, ModelSummary, PipelineOptions, runPipeline } from './pipeline';
import { seasonalNaive } from './seasonal-naive';
import { withExcluded } from './series/series';

export type BacktestMethod = 'auto' | 'seasonal-naive' | ModelChoice;

export interface BacktestOptions {
  /** number of operating days to score (the last N complete days) */
  days: number;
  method?: BacktestMethod;
  issueHour?: number;
  /** indices of operating-day starts, ascending; default every 24 hours from 0 */
  dayStarts?: number[];
  /**
   * with dayStarts: for each day start, the index of the first hour not yet known when that day's
   * forecast is issued (at most the day start); overrides issueHour
   */
  origins?: number[];
  /** indices of hours marked as outage or bad data */
  excluded?: Iterable<number>;
  /** hours of history each fit may use (default 8 weeks) */
  windowHours?: number;
  /** 'auto' only: choose differencing and orders again every k days, refit coefficients in
   *  between with the orders fixed (default 7; 1 = full selection every day) */
  reselectEveryDays?: number;
  pipeline?: PipelineOptions;
}

export interface BacktestDay {
  dayStart: number;
  hours: number;
  origin: number;
  model: string;
  /** differencing and orders used (absent for seasonal naive without a fitted model) */
  choice?: ModelChoice;
  fallbackReason?: string;
  fitMs: number;
  accuracy: Accuracy;
  baseline: Accuracy;
  forecast: IntervalForecast;
}

export interface BacktestSummary {
  mape: number;
  mae: number;
  rmse: number;
  bias: number;
  peakError: number;
  coverage80: number;
  coverage95: number;
}

export interface BacktestResult extends BacktestSummary {
  method: string;
  days: BacktestDay[];
  baseline: BacktestSummary;
  /** 1 − MAPE/baseline MAPE */
  improvement: number;
  timings: { totalMs: number; meanFitMs: number; maxFitMs: number };
}

export function backtest(values: ArrayLike<number>, o: BacktestOptions): BacktestResult {
  const t0 = performance.now();
  const y = withExcluded(values, o.excluded);
  const n = y.length;
  const method = o.method ?? 'auto';
  const window = o.windowHours ?? 8 * 168;
  const starts = o.dayStarts ?? Array.from({ length: Math.floor(n / 24) + 1 }, (_, i) => i * 24);
  if (o.origins && o.origins.length !== starts.length) throw new Error(`backtest: ${o.origins.length} issue times for ${starts.length} day starts`);
  // complete days: start and next start both inside the series
  const days: Array<[number, number]> = [];
  for (let i = 0; i + 1 < starts.length; i++) if (starts[i + 1] <= n) days.push([starts[i], starts[i + 1]]);
  const target = days.slice(Math.max(0, days.length - o.days));
  const out: BacktestDay[] = [];
  let fixed: ModelChoice | undefined = typeof method === 'object' ? method : undefined;
  let sinceSelect = Infinity;
  let warm: ModelChoice['start'];
  const every = Math.max(1, o.reselectEveryDays ?? 7);
  for (const [ds, de] of target) {
    const prevIdx = days.findIndex((d) => d[0] === ds) - 1;
    const prevStart = prevIdx >= 0 ? days[prevIdx][0] : ds - 24;
    const origin = o.origins ? Math.min(ds, o.origins[prevIdx + 1]) : o.issueHour === undefined ? ds : Math.min(ds, prevStart + o.issueHour);
    if (origin < 168 * 3) continue;
    const from = Math.max(0, origin - window);
    const hist = y.subarray(from, origin);
    const h = de - origin;
    const lead = ds - origin;
    const actual = y.subarray(ds, de);
    const base = seasonalNaive(hist, h);
    const cut = (f: IntervalForecast): IntervalForecast => ({
      mean: f.mean.slice(lead),
      se: f.se.slice(lead),
      lower80: f.lower80.slice(lead),
      upper80: f.upper80.slice(lead),
      lower95: f.lower95.slice(lead),
      upper95: f.upper95.slice(lead),
    });
    let fc: IntervalForecast;
    let model: string;
    let reason: string | undefined;
    let fitMs = 0;
    let choice: ModelChoice | undefined;
    if (method === 'seasonal-naive') {
      fc = base;
      model = 'seasonal naive';
    } else {
      const useFixed = typeof method === 'object' || (fixed && sinceSelect < every);
      // with the orders fixed, each day's fit starts from the previous day's coefficients (one
      // more day of data moves the optimum little, so BFGS needs a few iterations instead of a
      // few dozen); the forecasts are scored only, so no standard errors are computed
      const fixedNow = useFixed && fixed ? { ...fixed, start: fixed.start ?? warm } : undefined;
      const r = runPipeline({ history: hist, horizon: h, options: { ...o.pipeline, computeSe: false, fixed: fixedNow } });
      warm = useFixed && r.model && fixed && sameOrders(r.model, fixed) ? startOf(r.model) : undefined;
      if (method === 'auto' && !useFixed) {
        sinceSelect = 0;
        fixed = r.model ? choiceOf(r.model) : undefined;
      }
      sinceSelect++;
      fc = r.forecast;
      fitMs = r.timings.totalMs;
      reason = r.fallbackReason;
      choice = r.model ? choiceOf(r.model) : undefined;
      model = r.method === 'arima' && r.model ? describeModel(r.model) : 'seasonal naive';
    }
    const f = cut(fc);
    const b = cut(base);
    out.push({ dayStart: ds, hours: de - ds, origin, model, choice, fallbackReason: reason, fitMs, accuracy: accuracy(actual, f), baseline: accuracy(actual, b), forecast: f });
  }
  const s = summarize(out.map((d) => d.accuracy));
  const baseline = summarize(out.map((d) => d.baseline));
  const fits = out.map((d) => d.fitMs);
  return {
    method: typeof method === 'string' ? method : `fixed ${describeModel({ label: method.diff.join('×'), ...method })}`,
    days: out,
    ...s,
    baseline,
    improvement: 1 - s.mape / baseline.mape,
    timings: {
      totalMs: performance.now() - t0,
      meanFitMs: fits.length ? fits.reduce((a, b) => a + b, 0) / fits.length : 0,
      maxFitMs: fits.length ? Math.max(...fits) : 0,
    },
  };
}

/**
 * A backtest's summary over its days: the mean daily MAPE, MAE, bias and absolute peak-hour error,
 * and RMSE and coverage over all hours (each day weighted by its hours); days without a scored hour
 * are left out.
 */
export function summarize(all: Accuracy[]): BacktestSummary {
  const list = all.filter((a) => a.n > 0);
  const mean = (f: (a: Accuracy) => number) => {
    const v = list.map(f).filter(Number.isFinite);
    return v.length ? v.reduce((s, x) => s + x, 0) / v.length : NaN;
  };
  const tot = list.reduce((s, a) => s + a.n, 0);
  const w = (f: (a: Accuracy) => number) => (tot ? list.reduce((s, a) => s + (Number.isFinite(f(a)) ? f(a) * a.n : 0), 0) / tot : NaN);
  return {
    mape: mean((a) => a.mape),
    mae: mean((a) => a.mae),
    rmse: Math.sqrt(w((a) => a.rmse * a.rmse)),
    bias: mean((a) => a.bias),
    peakError: mean((a) => Math.abs(a.peakError)),
    coverage80: w((a) => a.coverage80),
    coverage95: w((a) => a.coverage95),
  };
}

/** Differencing and orders of a fitted model, its seasonal block included. */
export function choiceOf(m: ModelSummary): ModelChoice {
  return { diff: m.diff, p: m.p, q: m.q, ...(m.P + m.Q > 0 ? { P: m.P, Q: m.Q, period: m.period } : {}) };
}

/** "(1−B^168) ARMA(3,1)×(1,1)_24" */
export function describeModel(m: { label: string; p: number; q: number; P?: number; Q?: number; period?: number }): string {
  const seasonal = (m.P ?? 0) + (m.Q ?? 0) > 0 ? `×(${m.P ?? 0},${m.Q ?? 0})_${m.period}` : '';
  return `${m.label} ARMA(${m.p},${m.q})${seasonal}`;
}

function sameOrders(m: ModelSummary, c: ModelChoice): boolean {
  return m.p === c.p && m.q === c.q && m.P === (c.P ?? 0) && m.Q === (c.Q ?? 0) && m.diff.length === c.diff.length && m.diff.every((d, i) => d === c.diff[i]);
}

/** The fitted coefficients of a model summary as starting values for the next fit. */
function startOf(m: ModelSummary): ModelChoice['start'] {
  const pick = (prefix: string, k: number): number[] => Array.from({ length: k }, (_, i) => m.coefficients.find((c) => c.name === `${prefix}${i + 1}`)?.value ?? 0);
  return { ar: pick('ar', m.p), ma: pick('ma', m.q), sar: pick('sar', m.P), sma: pick('sma', m.Q) };
}
