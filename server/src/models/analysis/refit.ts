/**
 * The refit tasks the compute pool runs (plain functions of structured-cloneable payloads, no
 * framework): a zone's fit with its short backtest, and forecasts from a stored model.
 *
 * What the desk asks of the engine: `requireBeatBaseline: false`. The engine's default hides a
 * model that loses to weekly seasonal naive on the last seven days, which on real load happens
 * often by a hair (the two are close on a calm week) and would leave a zone without any model.
 * The desk keeps the fitted model, stores both MAPEs, and decides in the open: promotion compares
 * candidates with the model in service, and operators see the baseline beside them. Seasonal
 * naive still stands in when the fit fails or gives a non-finite forecast.
 */
import {
  applyArima,
  backtest,
  DEFAULT_CANDIDATES,
  DEFAULT_DAY_AHEAD_CHOICE,
  choiceOf,
  scaleBands,
  UNSCALED,
  type BandScale,
  floorAtZero,
  forecastArima,
  normalizeSpec,
  runPipeline,
  runWeatherPipeline,
  forecastTemperature,
  responseSd,
  responseValues,
  type ArmaFit,
  type CalendarHours,
  type TemperatureVintage,
  type WeatherChoice,
  type WeatherPipelineResult,
  type CandidateResult,
  type IntervalForecast,
  type ModelChoice,
  type ModelSummary,
  type PipelineOptions,
} from '@morrowline/engine';
import type { StoredModel, StoredWeather } from '../stored-model';
import { storedResponse } from './weather-what-if';
import { hasWeatherTerms, scoreWeatherChoice } from './weather-score';


/**
 * Exact-ML fits per differencing after the Hannan–Rissanen screening: 2 rather than the engine's
 * 4 halves the selection time; the orders ranked third and fourth by the screening rarely win.
 */
export const REFIT_SCREEN = 2;

/**
 * Whether the nightly and hourly refits try the engine's lag-24 seasonal block on the
 * weekly-differenced series. On since 5 December 2026: `npm run bench:refit` (200 zones of eight
 * weeks with the demo zones' occasional missing hours, quiet machine, README "Benchmarks") took
 * 52.9 s with the block and the engine's other choices below, against 65.2 and 67.2 s without
 * them, within the nightly refit's two minutes. It had been off while the block cost 2–4 times
 * the time (216–412 s on 3 December: a state of about 28 had no exact gradient and, with a
 * missing hour anywhere, its whole covariance tracked from the first hour).
 */
export const REFIT_SEASONAL_BLOCK = true;

/**
 * The differencings the desk's refits try, how many orders of each the day-ahead backtest
 * chooses among, and whether orders with an MA unit root are left out: the engine's own
 * defaults, which with the seasonal block made the open demand series' rolling day-ahead MAPE
 * 0.957 % over 28 days against 1.075 % with the three differencings and the criterion alone
 * (README, "Day-ahead backtests"). Without the block the fourth differencing and the day-ahead
 * choice had made it worse, which is why the desk kept them out while the block was off.
 */
export const DESK_CANDIDATES: number[][] = DEFAULT_CANDIDATES;
export const DESK_DAY_AHEAD_CHOICE = DEFAULT_DAY_AHEAD_CHOICE;
/** The engine's check for an MA unit root (a difference too many) came with the fourth
 *  differencing and was measured with it; the desk takes it with it. */
export const DESK_LEAVE_OUT_MA_UNIT_ROOTS = true;

/**
 * How the desk's pipeline chooses a zone's model: the engine's four weeks of rolling day-ahead
 * origins for the differencing and the bands, with the screening, seasonal block and candidates
 * above. The workbench's model report runs the same, so that what it shows is what a refit would
 * choose.
 */
export const DESK_PIPELINE_OPTIONS: PipelineOptions = {
  screen: REFIT_SCREEN,
  candidates: DESK_CANDIDATES,
  dayAheadChoice: DESK_DAY_AHEAD_CHOICE,
  leaveOutMaUnitRoots: DESK_LEAVE_OUT_MA_UNIT_ROOTS,
  ...(REFIT_SEASONAL_BLOCK ? {} : { seasonalBlock: false as const }),
};

/** Days of the short backtest that scores each fit (kept short so refits stay fast). */
export const REFIT_BACKTEST_DAYS = 7;

export interface RefitPayload {
  /** hourly MW, oldest first, NaN for missing hours; excluded hours may be NaN already */
  values: Float64Array;
  /** indices of outage / bad-data hours */
  excluded: number[];
  horizon: number;
  /** full: differencing and order selection; update: these orders kept */
  fixed?: ModelChoice;
  /** the model in service, scored on the same days for the promotion rule */
  inService?: ModelChoice | null;
  /** the weather terms of the model in service (it is then scored on forecast weather, as it forecasts) */
  inServiceWeather?: WeatherChoice | null;
  backtestDays?: number;
  /** exact-ML fits per differencing after the screening (default REFIT_SCREEN) */
  screen?: number;
  /** the zone's weather and calendar on the history's timeline (./zone-weather-inputs); absent: no observed temperature */
  weather?: RefitWeather;
}

export interface RefitWeather {
  /** UTC ms of hour 0 of the timeline (for the vintage's issue time in the result) */
  firstHourMs: number;
  /** observed zone temperature of the history's hours, NaN missing */
  temperature: Float64Array;
  /** only vintages issued at or before `issuedAt` are sent (and the engine reads no later one) */
  vintages: TemperatureVintage[];
  calendar: CalendarHours;
  /** the forecast's issue time, hours from the start of hour 0 */
  issuedAt: number;
  /** update: the terms and thresholds of the version in service, kept */
  fixed?: WeatherChoice;
}

export interface ScoreResult {
  mape: number | null;
  baselineMape: number | null;
  /** shares (0..1) of the scored hours inside the model's 80 % and 95 % bands */
  coverage80: number | null;
  coverage95: number | null;
  days: number;
  from: number | null;
  to: number | null;
  /** true: scored with the version's weather terms on the temperature forecast known at each origin */
  onForecastWeather: boolean;
}

export interface RefitResult {
  method: 'arima' | 'seasonal-naive';
  fallbackReason: string | null;
  model: ModelSummary | null;
  /** natural parameters of the fit, to store beside the named coefficients */
  stored: StoredModel | null;
  forecast: IntervalForecast;
  candidates: CandidateResult[];
  warnings: string[];
  score: ScoreResult | null;
  inServiceScore: ScoreResult | null;
  fitMs: number;
  totalMs: number;
  /** the weather terms tried (used or not); null without weather */
  weather?: StoredWeather | null;
}

const finiteOrNull = (v: number): number | null => (Number.isFinite(v) ? v : null);

/** Rolling day-ahead backtest of fixed orders (coefficients refitted each day). */
export function scoreChoice(values: Float64Array, excluded: number[], choice: ModelChoice, days: number): ScoreResult {
  const { start: _start, ...plain } = choice;
  void _start;
  const r = backtest(values, { days, method: plain, excluded });
  return {
    mape: finiteOrNull(r.mape),
    baselineMape: finiteOrNull(r.baseline.mape),
    coverage80: finiteOrNull(r.coverage80),
    coverage95: finiteOrNull(r.coverage95),
    days: r.days.length,
    from: r.days.length ? r.days[0].dayStart : null,
    to: r.days.length ? r.days[r.days.length - 1].dayStart + r.days[r.days.length - 1].hours : null,
    onForecastWeather: false,
  };
}

/** Fits a zone's model (full selection, or the orders kept), scores it and forecasts. */
export function refitZone(payload: RefitPayload): RefitResult {
  const t0 = performance.now();
  const days = payload.backtestDays ?? REFIT_BACKTEST_DAYS;
  const r = runPipeline({
    history: payload.values,
    excluded: payload.excluded,
    horizon: payload.horizon,
    // the differencing is chosen on the engine's four weeks of origins, not on the short score
    options: { ...DESK_PIPELINE_OPTIONS, fixed: payload.fixed, requireBeatBaseline: false, screen: payload.screen ?? REFIT_SCREEN },
  });
  const model = r.method === 'arima' ? (r.model ?? null) : null;
  const w = model && payload.weather ? withWeather(payload, choiceOf(model)) : null;
  let score: ScoreResult | null = null;
  let inServiceScore: ScoreResult | null = null;
  if (model) {
    // a version is scored as it forecasts: with its weather terms on the temperature forecast
    // known at each day's origin when it keeps them, otherwise the model without weather
    const kept = w?.stored.used ? w.stored.choice : null;
    score = hasWeatherTerms(kept) ? scoreWeatherChoice(payload.values, payload.excluded, payload.weather!, kept, days, { pipeline: DESK_PIPELINE_OPTIONS }) : scoreChoice(payload.values, payload.excluded, choiceOf(model), days);
    if (payload.inService) {
      const theirs = payload.inServiceWeather;
      inServiceScore =
        hasWeatherTerms(theirs) && payload.weather
          ? scoreWeatherChoice(payload.values, payload.excluded, payload.weather, theirs, days, { pipeline: DESK_PIPELINE_OPTIONS })
          : scoreChoice(payload.values, payload.excluded, payload.inService, days);
    }
  }
  return {
    method: model ? 'arima' : 'seasonal-naive',
    fallbackReason: r.fallbackReason ?? null,
    model,
    stored: model ? storedOf(model, r.bandScale) : null,
    // a model with weather terms forecasts on the temperature forecast known at the issue time,
    // its bands widened by that forecast's uncertainty (the engine's weather pipeline)
    forecast: w && w.stored.used ? w.result.forecast : r.forecast,
    weather: w ? { ...w.stored, ...(score?.onForecastWeather ? { scoredOnForecastWeather: true } : {}) } : null,
    candidates: r.candidates,
    warnings: r.warnings,
    score,
    inServiceScore,
    fitMs: r.timings.fitMs,
    totalMs: performance.now() - t0,
  };
}

/**
 * The engine's weather pipeline on the same history, the ARMA orders and differencing of the
 * model without weather kept (so it is not chosen twice): it decides by its rolling day-ahead
 * backtest on forecast weather whether the zone's load answers the temperature and the calendar.
 */
function withWeather(payload: RefitPayload, plain: ModelChoice): { result: WeatherPipelineResult; stored: StoredWeather } {
  const w = payload.weather!;
  const result = runWeatherPipeline({
    history: payload.values,
    excluded: payload.excluded,
    horizon: payload.horizon,
    temperature: w.temperature,
    vintages: w.vintages,
    calendar: w.calendar,
    issuedAt: w.issuedAt,
    options: {
      pipeline: { fixed: plain, requireBeatBaseline: false, screen: payload.screen ?? REFIT_SCREEN, ...(REFIT_SEASONAL_BLOCK ? {} : { seasonalBlock: false as const }) },
      requireBeatBaseline: false,
      ...(w.fixed ? { fixed: w.fixed } : {}),
    },
  });
  const terms = result.choice?.terms ?? { temperature: false, recency: false, calendar: false, heatBelow: NaN, coolAbove: NaN };
  const finite = (v: number): number | null => (Number.isFinite(v) ? v : null);
  return {
    result,
    stored: {
      used: result.method === 'regression-arima',
      description: result.description,
      terms: { temperature: terms.temperature, recency: terms.recency, calendar: terms.calendar, heatBelow: finite(terms.heatBelow) ?? 0, coolAbove: finite(terms.coolAbove) ?? 0, ...(terms.blockHours !== undefined ? { blockHours: terms.blockHours } : {}) },
      response: result.response.map((c) => ({ name: c.name, value: c.value, se: finite(c.se) })),
      responseCovariance: result.responseCovariance ?? null,
      candidates: result.candidates.map((c) => ({ label: c.label, mape: finite(c.mape) })),
      baselineMape: finite(result.baselineMape),
      selectionDays: result.selectionDays,
      vintageIssuedAt: Number.isFinite(result.vintageIssued) ? new Date(w.firstHourMs + result.vintageIssued * 3_600_000).toISOString() : null,
      choice: result.method === 'regression-arima' && result.choice ? result.choice : null,
      ...(result.errorModel ? { sigma2: result.errorModel.sigma2 } : {}),
      bandScale: { k80: result.bandScale.k80, k95: result.bandScale.k95 },
    },
  };
}

function storedOf(m: ModelSummary, bandScale: BandScale): StoredModel {
  const pick = (prefix: string, n: number) => Array.from({ length: n }, (_, i) => m.coefficients.find((c) => c.name === `${prefix}${i + 1}`)?.value ?? 0);
  const seasonal = m.P + m.Q > 0 ? { P: m.P, Q: m.Q, period: m.period, sar: pick('sar', m.P), sma: pick('sma', m.Q) } : {};
  return {
    diff: m.diff,
    p: m.p,
    q: m.q,
    ar: pick('ar', m.p),
    ma: pick('ma', m.q),
    sigma2: m.sigma2,
    mean: m.coefficients.find((c) => c.name === 'intercept')?.value ?? 0,
    ...seasonal,
    bandScale: { k80: bandScale.k80, k95: bandScale.k95 },
  };
}

export interface ForecastPayload {
  values: Float64Array;
  excluded: number[];
  horizon: number;
  model: StoredModel;
  /** a version with weather terms: its stored terms and the zone's weather as known at the issue time */
  weather?: { stored: StoredWeather; inputs: RefitWeather };
}

/**
 * Forecast from a stored model with its coefficients held (only the Kalman filter runs over the
 * latest history): the forecast of a version just promoted or rolled back to, its bands scaled
 * as they were calibrated when it was fitted.
 */
export function forecastStored(payload: ForecastPayload): { forecast: IntervalForecast } {
  if (payload.weather?.stored.used && payload.weather.stored.choice && payload.weather.stored.sigma2 !== undefined) return forecastStoredWithWeather(payload, payload.weather.stored, payload.weather.inputs);
  const m = payload.model;
  const y = Float64Array.from(payload.values);
  for (const i of payload.excluded) if (i >= 0 && i < y.length) y[i] = NaN;
  const spec = normalizeSpec({ p: m.p, q: m.q, P: m.P ?? 0, Q: m.Q ?? 0, period: m.period, includeMean: false });
  const arma = {
    spec,
    coefficients: [],
    ar: Float64Array.from(m.ar),
    ma: Float64Array.from(m.ma),
    sar: Float64Array.from(m.sar ?? []),
    sma: Float64Array.from(m.sma ?? []),
    mean: m.mean,
    sigma2: m.sigma2,
  } as unknown as ArmaFit;
  const fit = applyArima({ diff: m.diff, arma, filled: new Float64Array(0), filledCount: 0 }, y);
  const scale = m.bandScale ? { ...m.bandScale, hours: 0 } : UNSCALED;
  return { forecast: floorAtZero(scaleBands(forecastArima(fit, payload.horizon), scale)) };
}

/**
 * Forecast from a stored version with weather terms, every coefficient held: the error model
 * (its differencing and ARMA as fitted) filtered over u = y − x'β on the observed temperature,
 * plus the response on the temperature forecast known at the issue time, the temperature
 * forecast's variance added through the response (the engine's responseSd, as in its pipeline),
 * bands scaled as calibrated at the fit.
 */
function forecastStoredWithWeather(payload: ForecastPayload, w: StoredWeather, inputs: RefitWeather): { forecast: IntervalForecast } {
  const y = Float64Array.from(payload.values);
  for (const i of payload.excluded) if (i >= 0 && i < y.length) y[i] = NaN;
  const n = y.length;
  const h = payload.horizon;
  const r = storedResponse(w);
  const obs = inputs.temperature.subarray(0, n);
  const g0 = responseValues(r, obs, inputs.calendar, 0, n);
  const u = y.map((v, t) => v - g0[t]);
  const c = w.choice!.model;
  const spec = normalizeSpec({ p: c.p, q: c.q, P: c.P ?? 0, Q: c.Q ?? 0, period: c.period, includeMean: false });
  const arma = {
    spec,
    coefficients: [],
    ar: Float64Array.from(c.start?.ar ?? []),
    ma: Float64Array.from(c.start?.ma ?? []),
    sar: Float64Array.from(c.start?.sar ?? []),
    sma: Float64Array.from(c.start?.sma ?? []),
    mean: 0,
    sigma2: w.sigma2!,
  } as unknown as ArmaFit;
  const fit = applyArima({ diff: c.diff, arma, filled: new Float64Array(0), filledCount: 0 }, u);
  const zf = forecastArima(fit, h);
  const ft = forecastTemperature(obs, inputs.vintages, n, h, inputs.issuedAt);
  const g = responseValues(r, ft.path, inputs.calendar, n, n + h);
  const sdg = w.terms.temperature || w.terms.recency ? responseSd(r, ft.path, ft.members, ft.sd, inputs.calendar, n) : new Float64Array(h);
  const raw: IntervalForecast = { mean: zf.mean.map((m, j) => m + g[j]), se: zf.se.map((s, j) => Math.sqrt(s * s + sdg[j] * sdg[j])), lower80: [], upper80: [], lower95: [], upper95: [] };
  const scale = w.bandScale ? { ...w.bandScale, hours: 0 } : UNSCALED;
  return { forecast: floorAtZero(scaleBands(raw, scale)) };
}
