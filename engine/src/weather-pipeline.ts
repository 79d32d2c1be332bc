/**
 * The automatic pipeline with the weather and the calendar, for one zone: regression with ARIMA
 * errors, y_t = x_t'β + u_t with the same seasonal differencing and ARMA on u as the pipeline
 * without weather (./pipeline), fitted in two steps (β by least squares on the weekly
 * difference, ./load-response; then the ARMA by exact maximum likelihood on u = y − Xβ).
 *  1. The pipeline without weather runs as it does today (differencing, orders, its bands).
 *  2. The thresholds of the degree terms are chosen per zone by profile likelihood (./weather/load-response).
 *  3. Which terms the zone gets is decided like the differencing, by the rolling day-ahead
 *     backtest over the last four weeks of the history (Tashman 2000): each candidate term set
 *     (none, the calendar, the temperature, the temperature with its recency terms; Wang, Liu &
 *     Hong 2016) gets its β and its ARMA fitted (none: the model of step 1; the others: the
 *     differencing and orders the pipeline chooses on u of the fullest set), and from
 *     each origin its forecast of the next day is issued on the temperature forecast known at
 *     that origin (./weather/forecast-temperature: never a vintage issued later, never a temperature
 *     observed later), with the error model's forecast of u added. The simplest set within 2 % of
 *     the lowest mean daily MAPE wins (TERM_MARGIN): a zone whose load does not answer the weather
 *     keeps the model without it, and then gets exactly the result of step 1.
 *  4. The bands: the error model's variance plus the temperature forecast's, propagated through
 *     the fitted response (./weather/response-uncertainty), then calibrated on the standardised errors of
 *     the same backtest (weatherBandScale), so the calibration sees the weather forecast's misses
 *     as they were.
 * As in the pipeline, a model that loses to the weekly seasonal-naive forecast on the test days
 * is not served; the forecast is never negative.
 */
import { bandScaleFromErrors, BandScale, quantileSorted, scaleBands, UNSCALED } from './band-calibration';
import { Z95 } from './forecast';
import { DayAheadScore, scoreDayAhead } from './day-ahead-score';
import { ArimaFit, fitArima, forecastArima, IntervalForecast } from './forecast';
import { originForecaster } from './origin-forecasts';
import { floorAtZero, ModelChoice, PipelineOptions, PipelineResult, runPipeline } from './pipeline';
import { choiceOf, describeModel } from './backtest';
import { seasonalNaive } from './seasonal-naive';
import { countFinite, SeriesInput, toSeries, withExcluded } from './series/series';
import { describeDifferencing } from './differencing';
import { CalendarHours, plainCalendar, TEMPERATURE_BLOCK_HOURS, TermSet } from './weather/load-terms';
import { chooseThresholds, estimateResponse, hasTerms, LoadResponse, responseValues } from './weather/load-response';
import { ForecastTemperature, forecastTemperature } from './weather/forecast-temperature';
import { responseSd } from './weather/response-uncertainty';
import { TemperatureVintage } from './weather/vintages';

/** Terms and error model of a zone's model: what a refit chooses and an hourly update keeps. */
export interface WeatherChoice {
  terms: TermSet;
  model: ModelChoice;
}

export interface WeatherPipelineOptions {
  /** options of the error model's selection (./pipeline); bands are calibrated here */
  pipeline?: PipelineOptions;
  /** candidate term sets (thresholds are chosen per zone; blocks of TEMPERATURE_BLOCK_HOURS unless given); default: none, calendar, temperature, temperature with recency (with the calendar when one is given) */
  termSets?: Array<Pick<TermSet, 'temperature' | 'recency' | 'calendar' | 'blockHours'>>;
  /** skip the choice: these terms, thresholds, differencing and orders (β and ARMA re-estimated) */
  fixed?: WeatherChoice;
  /** days of rolling origins for the choice and the band calibration (default 28) */
  selectionDays?: number;
  calibrateBands?: boolean;
  /** serve seasonal naive when the model loses to it on the test days (default true) */
  requireBeatBaseline?: boolean;
}

export interface WeatherPipelineInput {
  /** hourly load, oldest first, NaN for missing; the forecast starts at the hour after the last */
  history: SeriesInput;
  excluded?: Iterable<number>;
  horizon: number;
  /** observed temperature on the load's timeline, °C (NaN missing); values from history.length on are never read */
  temperature: SeriesInput;
  /** temperature forecast vintages on the same timeline (./weather/vintages); only those issued by `issuedAt` are read */
  vintages?: readonly TemperatureVintage[];
  /** calendar facts for history.length + horizon hours (default: hour of day from 0, no special days) */
  calendar?: CalendarHours;
  /** issue time in hours from the start of hour 0 (default history.length: when the last load hour ended) */
  issuedAt?: number;
  /** what-if temperatures of the forecast hours (one value per hour of the horizon): the load each would mean */
  scenarios?: Array<{ name: string; temperature: ArrayLike<number> }>;
  options?: WeatherPipelineOptions;
}

export interface TermCandidate {
  label: string;
  terms: TermSet;
  /** mean daily MAPE (%) of its day-ahead forecasts on forecast weather over the test days */
  mape: number;
  error?: string;
}

export interface ResponseCoefficient {
  name: string;
  /** MW per unit of the term (per degree for a degree term, per hour for a dummy) */
  value: number;
  se: number;
}

export interface WeatherPipelineResult {
  method: 'regression-arima' | 'arima' | 'seasonal-naive';
  fallbackReason?: string;
  /** the chosen terms and error model (terms all false: the model without weather) */
  choice?: WeatherChoice;
  /** "(1−B^168) ARMA(3,1) + temperature, calendar" */
  description: string;
  /** the fitted response (estimated coefficients only) */
  response: ResponseCoefficient[];
  /** the least-squares covariance of those coefficients (row-major, in the order of `names`), for bands on their sums; absent without terms */
  responseCovariance?: { names: string[]; values: number[] };
  /** the error model's innovation variance and criteria */
  errorModel?: { sigma2: number; loglik: number; aicc: number; coefficients: Array<{ name: string; value: number; se: number }> };
  forecast: IntervalForecast;
  /** per forecast hour: the response x'β, the temperature used, the sd the temperature forecast adds (MW) */
  regression: number[];
  temperature: number[];
  weatherSd: number[];
  /** issue time of the temperature forecast vintage used (NaN: none, persistence) */
  vintageIssued: number;
  candidates: TermCandidate[];
  baselineMape: number;
  selectionDays: number;
  bandScale: BandScale;
  scenarios: Array<{ name: string; forecast: IntervalForecast }>;
  timings: { totalMs: number; selectionMs: number };
  warnings: string[];
}

const MIN_HOURS = 3 * 168;
/**
 * Parsimony in the choice of terms: the simplest set whose backtest MAPE is within 2 % (relative)
 * of the lowest wins, so terms must earn their place by more than the noise of four weeks of
 * origins (in the spirit of the one-standard-error rule, Hastie, Tibshirani & Friedman 2009, The
 * Elements of Statistical Learning, §7.10; the 2 % is ours, measured on the simulator's zones).
 */
export const TERM_MARGIN = 0.02;
const NO_TERMS = { temperature: false, recency: false, calendar: false };

export function describeTerms(t: TermSet): string {
  const parts: string[] = [];
  if (t.temperature) parts.push(`temperature (heating below ${t.heatBelow} °C, cooling above ${t.coolAbove} °C${t.recency ? ', recency' : ''})`);
  else if (t.recency) parts.push('recent temperature');
  if (t.calendar) parts.push('calendar');
  return parts.length ? parts.join(', ') : 'no weather or calendar terms';
}

interface Scored {
  terms: TermSet;
  response: LoadResponse;
  fit: ArimaFit;
  u: Float64Array;
  score: DayAheadScore;
}

export function runWeatherPipeline(input: WeatherPipelineInput): WeatherPipelineResult {
  const t0 = performance.now();
  const o = input.options ?? {};
  const h = Math.max(1, Math.floor(input.horizon));
  const y = withExcluded(input.history, input.excluded);
  const n = y.length;
  const issuedAt = input.issuedAt ?? n;
  const obsAll = toSeries(input.temperature);
  // never read a temperature observed after the issue time (nor after the last load hour)
  const obs = obsAll.subarray(0, Math.min(obsAll.length, n));
  const vintages = (input.vintages ?? []).filter((v) => v.issued <= issuedAt);
  const cal = input.calendar ?? plainCalendar(n + h);
  const warnings: string[] = [];
  const candidates: TermCandidate[] = [];
  const calibrate = o.calibrateBands ?? true;

  // evidence: the pipeline's test days (../pipeline, testDays)
  const lead = Math.max(0, h - 24);
  let days = Math.max(0, Math.floor(o.selectionDays ?? 28));
  while (days > 0 && n - days * 24 - lead - 168 < 168) days--;
  const testStart = n - days * 24;
  const baseline = scoreDayAhead(y, testStart, days, lead, (origin, hh) => seasonalNaive(y.subarray(0, origin), hh));

  const empty = (reason: string): WeatherPipelineResult => {
    const bandScale = calibrate && days > 0 ? bandScaleFromErrors(baseline.z) : UNSCALED;
    return {
      method: 'seasonal-naive',
      fallbackReason: reason,
      description: 'weekly seasonal naive',
      response: [],
      forecast: floorAtZero(scaleBands(seasonalNaive(y, h), bandScale)),
      regression: new Array(h).fill(0),
      temperature: [],
      weatherSd: new Array(h).fill(0),
      vintageIssued: NaN,
      candidates,
      baselineMape: baseline.mape,
      selectionDays: days,
      bandScale,
      scenarios: [],
      timings: { totalMs: performance.now() - t0, selectionMs: 0 },
      warnings,
    };
  };
  if (countFinite(y) < MIN_HOURS) return empty(`only ${countFinite(y)} hours of usable history; the model needs at least ${MIN_HOURS}`);
  if (days < 1) return empty('the history is too short for a test day');

  // the temperature each test origin's forecast is issued on: as known at that origin
  const lastOrigin = testStart + (days - 1) * 24 - lead;
  const atOrigin = new Map<number, ForecastTemperature>();
  const temperatureAt = (origin: number, hh: number): ForecastTemperature => {
    let ft = atOrigin.get(origin);
    if (!ft || ft.sd.length < hh) atOrigin.set(origin, (ft = forecastTemperature(obs.subarray(0, origin), vintages, origin, hh)));
    return ft;
  };

  const score = (terms: TermSet, response: LoadResponse, fit: ArimaFit, u: Float64Array): DayAheadScore => {
    const zf = originForecaster(fit, u, lastOrigin, lead + 24);
    const issued = new Map<number, IntervalForecast>();
    const s = scoreDayAhead(y, testStart, days, lead, (origin, hh) => {
      const f = forecastFrom(origin, hh);
      issued.set(origin, f);
      return f;
    });
    return { ...s, z: ordinaryDayErrors(issued) };
    function forecastFrom(origin: number, hh: number): IntervalForecast {
      const f = zf(origin, hh);
      if (!hasTerms(terms)) return f;
      const ft = temperatureAt(origin, hh);
      const g = responseValues(response, ft.path, cal, origin, origin + hh);
      const sdg = terms.temperature || terms.recency ? responseSd(response, ft.path, ft.members, ft.sd.subarray(0, hh), cal, origin) : new Float64Array(hh);
      return {
        mean: f.mean.map((m, j) => m + g[j]),
        se: f.se.map((s, j) => Math.sqrt(s * s + sdg[j] * sdg[j])),
        lower80: [],
        upper80: [],
        lower95: [],
        upper95: [],
      };
    }
  };

  /** the standardised errors of the backtest's days for the band calibration (calibrationErrors) */
  const ordinaryDayErrors = (issued: Map<number, IntervalForecast>): number[] => {
    const specialIn = (from: number, to: number): boolean => {
      for (let t = Math.max(0, from); t < to; t++) if (cal.holiday[t] || cal.bridge[t]) return true;
      return false;
    };
    const list: CalibrationDay[] = [];
    for (let d = 0; d < days; d++) {
      const ws = testStart + d * 24;
      const f = issued.get(ws - lead);
      if (!f) continue;
      const z: number[] = [];
      for (let i = 0; i < 24 && ws + i < n; i++) {
        const a = y[ws + i];
        const se = f.se[lead + i];
        if (Number.isFinite(a) && se > 0) z.push((a - f.mean[lead + i]) / se);
      }
      list.push({ z, specialWeek: specialIn(ws - 168, ws + 24), specialNear: specialIn(ws - 24, ws + 24) });
    }
    return calibrationErrors(list, days);
  };

  const fitTerms = (terms: TermSet, model: ModelChoice): Scored => {
    const response = hasTerms(terms) ? estimateResponse(y, obs, cal, terms) : estimateResponse(y, obs, cal, { ...terms, ...NO_TERMS });
    const g = responseValues(response, obs, cal, 0, n);
    const u = new Float64Array(n);
    for (let t = 0; t < n; t++) u[t] = y[t] - g[t];
    const { start, ...spec } = model;
    const fit = fitArima(u, { ...spec, includeMean: false }, { start, computeSe: false });
    return { terms, response, fit, u, score: score(terms, response, fit, u) };
  };

  /** The pipeline without weather's own result, as this pipeline's (the zone keeps the model without weather). */
  const fromPlain = (p: PipelineResult, terms: TermSet, selectionMs: number): WeatherPipelineResult => {
    const ft = forecastTemperature(obs, vintages, n, h, issuedAt);
    const m = p.model;
    return {
      method: p.method,
      fallbackReason: p.fallbackReason,
      choice: m ? { terms: { ...terms, ...NO_TERMS }, model: { ...choiceOf(m), start: startOf(m.coefficients, m) } } : undefined,
      description: p.method === 'arima' && m ? `${describeModel(m)}, no weather or calendar terms` : 'weekly seasonal naive',
      response: [],
      errorModel: m ? { sigma2: m.sigma2, loglik: m.loglik, aicc: m.aicc, coefficients: m.coefficients.map((c) => ({ name: c.name, value: c.value, se: c.se })) } : undefined,
      forecast: p.forecast,
      regression: new Array(h).fill(0),
      temperature: Array.from(ft.path.subarray(n, n + h)),
      weatherSd: new Array(h).fill(0),
      vintageIssued: ft.vintageIssued,
      candidates,
      baselineMape: p.baselineMape,
      selectionDays: p.selectionDays,
      bandScale: p.bandScale,
      scenarios: (input.scenarios ?? []).map((sc) => ({ name: sc.name, forecast: p.forecast })),
      timings: { totalMs: performance.now() - t0, selectionMs },
      warnings: [...warnings, ...p.warnings],
    };
  };

  const ts = performance.now();
  let best: Scored;
  // The model without weather is the pipeline without weather itself (./pipeline), so a zone that
  // keeps it gets exactly today's forecast and bands.
  const plainResult = (model?: ModelChoice): PipelineResult =>
    runPipeline({ history: y, horizon: h, options: { ...o.pipeline, selectionDays: days, ...(model ? { fixed: model } : {}) } });
  try {
    if (o.fixed) {
      if (!hasTerms(o.fixed.terms)) return fromPlain(plainResult(o.fixed.model), o.fixed.terms, performance.now() - ts);
      best = fitTerms(o.fixed.terms, o.fixed.model);
      candidates.push({ label: describeTerms(best.terms), terms: best.terms, mape: best.score.mape });
    } else {
      // calendar candidates only when the calendar has a special day in the history or the forecast
      const withCalendar = input.calendar !== undefined && hasSpecialDay(cal, n + h);
      const sets: NonNullable<WeatherPipelineOptions['termSets']> = o.termSets ?? [
        NO_TERMS,
        ...(withCalendar ? [{ temperature: false, recency: false, calendar: true }] : []),
        { temperature: true, recency: false, calendar: withCalendar },
        { temperature: true, recency: true, calendar: withCalendar },
      ];
      const fullest = sets.reduce((a, b) => (+b.temperature + +b.recency + +b.calendar > +a.temperature + +a.recency + +a.calendar ? b : a));
      const blockHours = fullest.blockHours ?? TEMPERATURE_BLOCK_HOURS;
      const thresholds = chooseThresholds(y, obs, cal, { ...fullest, heatBelow: 14, coolAbove: 20, blockHours }).terms;
      const plain = plainResult();
      if (!plain.model) return fromPlain(plain, { ...NO_TERMS, heatBelow: thresholds.heatBelow, coolAbove: thresholds.coolAbove }, performance.now() - ts);
      // the model without weather: today's pipeline, scored like the others
      const plainModel = { ...choiceOf(plain.model), start: startOf(plain.model.coefficients, plain.model) };
      // the weather candidates' differencing and orders: the pipeline's choice on u of the fullest set
      // (the load's own orders describe weather-driven swings the terms take out; measured on the
      // simulator's zones, they doubled the perfect-weather error)
      const full = { ...fullest, heatBelow: thresholds.heatBelow, coolAbove: thresholds.coolAbove, blockHours };
      const gFull = responseValues(estimateResponse(y, obs, cal, full), obs, cal, 0, n);
      const uFull = new Float64Array(n);
      for (let t = 0; t < n; t++) uFull[t] = y[t] - gFull[t];
      const sel = runPipeline({ history: uFull, horizon: h, options: { ...o.pipeline, calibrateBands: false, requireBeatBaseline: false, computeSe: false, selectionDays: days } });
      const weatherModel = sel.model ? { ...choiceOf(sel.model), start: startOf(sel.model.coefficients, sel.model) } : plainModel;
      const scored: Scored[] = [];
      for (const set of sets) {
        const terms = { ...set, heatBelow: thresholds.heatBelow, coolAbove: thresholds.coolAbove, blockHours: set.blockHours ?? TEMPERATURE_BLOCK_HOURS };
        try {
          const sc = fitTerms(terms, hasTerms(terms) ? weatherModel : plainModel);
          candidates.push({ label: describeTerms(terms), terms, mape: sc.score.mape });
          if (Number.isFinite(sc.score.mape)) scored.push(sc);
        } catch (e) {
          candidates.push({ label: describeTerms(terms), terms, mape: NaN, error: (e as Error).message });
        }
      }
      if (!scored.length) throw new Error('no term set could be fitted');
      // parsimony: the first (simplest) set within TERM_MARGIN of the lowest MAPE
      const lowest = Math.min(...scored.map((c) => c.score.mape));
      best = scored.find((c) => c.score.mape <= lowest * (1 + TERM_MARGIN))!;
      if (!hasTerms(best.terms)) return fromPlain(plain, best.terms, performance.now() - ts);
    }
  } catch (e) {
    return empty(`model selection failed: ${(e as Error).message}`);
  }
  const selectionMs = performance.now() - ts;
  if (o.pipeline?.computeSe ?? true) {
    // the served model's standard errors (the choice's fits skip the Hessian)
    const b = best.fit.arma;
    try {
      const fit = fitArima(best.u, { diff: best.fit.diff, p: b.spec.p, q: b.spec.q, P: b.spec.P, Q: b.spec.Q, period: b.spec.period, includeMean: false }, { start: { ar: b.ar, ma: b.ma, sar: b.sar, sma: b.sma }, computeSe: true });
      best = { ...best, fit };
    } catch (e) {
      warnings.push(`standard errors of the error model could not be computed: ${(e as Error).message}`);
    }
  }

  const a = best.fit.arma;
  const modelChoice: ModelChoice = {
    diff: best.fit.diff,
    p: a.spec.p,
    q: a.spec.q,
    ...(a.spec.P + a.spec.Q > 0 ? { P: a.spec.P, Q: a.spec.Q, period: a.spec.period } : {}),
    start: { ar: Array.from(a.ar), ma: Array.from(a.ma), sar: Array.from(a.sar), sma: Array.from(a.sma) },
  };
  const choice: WeatherChoice = { terms: best.terms, model: modelChoice };
  const weather = hasTerms(best.terms);
  const label = `${describeDifferencing(best.fit.diff)} ARMA(${a.spec.p},${a.spec.q})${a.spec.P + a.spec.Q > 0 ? `×(${a.spec.P},${a.spec.Q})_${a.spec.period}` : ''}`;
  if ((o.requireBeatBaseline ?? true) && !o.fixed && Number.isFinite(baseline.mape) && best.score.mape > baseline.mape) {
    const r = empty(`the model (MAPE ${best.score.mape.toFixed(2)} %) did not beat seasonal naive (${baseline.mape.toFixed(2)} %) on the last ${days} days`);
    return { ...r, choice, timings: { totalMs: performance.now() - t0, selectionMs } };
  }

  // the forecast: the error model's from the end of the history, plus the response on the temperature known at the issue time
  const zf = forecastArima(best.fit, h);
  const ft = forecastTemperature(obs, vintages, n, h, issuedAt);
  const g = weather ? responseValues(best.response, ft.path, cal, n, n + h) : new Float64Array(h);
  const sdg = best.terms.temperature || best.terms.recency ? responseSd(best.response, ft.path, ft.members, ft.sd, cal, n) : new Float64Array(h);
  const raw: IntervalForecast = {
    mean: zf.mean.map((m, j) => m + g[j]),
    se: zf.se.map((s, j) => Math.sqrt(s * s + sdg[j] * sdg[j])),
    lower80: [],
    upper80: [],
    lower95: [],
    upper95: [],
  };
  if (!raw.mean.every(Number.isFinite) || !raw.se.every(Number.isFinite)) return empty('the model produced a non-finite forecast (is the temperature known for every forecast hour?)');
  const bandScale = calibrate ? weatherBandScale(best.score.z) : UNSCALED;
  const scenarios = (input.scenarios ?? []).map((s) => {
    const path = Float64Array.from(ft.path);
    for (let j = 0; j < h; j++) path[n + j] = s.temperature[j];
    const gs = weather ? responseValues(best.response, path, cal, n, n + h) : new Float64Array(h);
    const f: IntervalForecast = { mean: zf.mean.map((m, j) => m + gs[j]), se: zf.se.slice(), lower80: [], upper80: [], lower95: [], upper95: [] };
    return { name: s.name, forecast: floorAtZero(scaleBands(f, bandScale)) };
  });
  return {
    method: weather ? 'regression-arima' : 'arima',
    choice,
    description: `${label}${weather ? ` + ${describeTerms(best.terms)}` : ', no weather or calendar terms'}`,
    response: best.response.names.flatMap((name, i) => (best.response.estimated[i] ? [{ name, value: best.response.beta[i], se: best.response.se[i] }] : [])),
    ...(weather && best.response.covariance.names.length ? { responseCovariance: { names: best.response.covariance.names, values: Array.from(best.response.covariance.values) } } : {}),
    errorModel: { sigma2: a.sigma2, loglik: a.loglik, aicc: a.aicc, coefficients: a.coefficients.map((c) => ({ name: c.name, value: c.value, se: c.se })) },
    forecast: floorAtZero(scaleBands(raw, bandScale)),
    regression: Array.from(g),
    temperature: Array.from(ft.path.subarray(n, n + h)),
    weatherSd: Array.from(sdg),
    vintageIssued: ft.vintageIssued,
    candidates,
    baselineMape: baseline.mape,
    selectionDays: days,
    bandScale,
    scenarios,
    timings: { totalMs: performance.now() - t0, selectionMs },
    warnings,
  };
}

export interface CalibrationDay {
  /** standardised errors of the day's hours */
  z: number[];
  /** the day, or a day of the week before it, is a public holiday or bridge day */
  specialWeek: boolean;
  /** the day itself or the day before it is a public holiday or bridge day */
  specialNear: boolean;
}

/**
 * Standardised errors for the band calibration from ordinary days only: a day that is, or whose
 * day or week before was, a public holiday or bridge day is left out. Their errors belong to
 * the special days (a holiday's own, and its echo through the daily and weekly differences);
 * with Christmas in the four weeks, they widened every band of the weeks after by a third.
 * Kept only when at least half of the days remain; otherwise (the weeks after Christmas and the
 * New Year) only the special days themselves and the day after each are left out, when at
 * least half remain: falling back to every error put the special days' misses of 40 % back
 * into the calibration and widened the January bands until they covered 99–100 %.
 */
export function calibrationErrors(list: readonly CalibrationDay[], days: number): number[] {
  const pick = (keep: (d: CalibrationDay) => boolean): number[] => list.filter(keep).flatMap((d) => d.z);
  if (list.filter((d) => !d.specialWeek).length * 2 >= days) return pick((d) => !d.specialWeek);
  if (list.filter((d) => !d.specialNear).length * 2 >= days) return pick((d) => !d.specialNear);
  return pick(() => true);
}

function startOf(coefficients: ReadonlyArray<{ name: string; value: number }>, m: { p: number; q: number; P: number; Q: number }): ModelChoice['start'] {
  const pick = (prefix: string, k: number): number[] => Array.from({ length: k }, (_, i) => coefficients.find((c) => c.name === `${prefix}${i + 1}`)?.value ?? 0);
  return { ar: pick('ar', m.p), ma: pick('ma', m.q), sar: pick('sar', m.P), sma: pick('sma', m.Q) };
}

function hasSpecialDay(c: CalendarHours, hours: number): boolean {
  for (let i = 0; i < Math.min(hours, c.holiday.length); i++) if (c.holiday[i] || c.bridge[i]) return true;
  return false;
}

/**
 * Band scales for the model with weather: the calibration of ../band-calibration (empirical
 * quantiles of the standardised backtest errors, Williams & Goodman 1971), except that the 95 %
 * band may also be narrowed (down to half). The pipeline without weather never narrows it,
 * because a calm month of errors would narrow the band before a rough week; here the rough weeks
 * are the weather's, and their variance is already in the standard error (the temperature
 * forecast's error, measured by lead), while that variance is an upper bound (the delta method
 * with the temperature errors taken as perfectly correlated over the hours a term reads), so
 * the errors may show it too wide. The 80 % band keeps its width relative to the 95 % band.
 */
export function weatherBandScale(z: ArrayLike<number>): BandScale {
  const base = bandScaleFromErrors(z);
  if (base.hours === 0) return base;
  const abs: number[] = [];
  for (let i = 0; i < z.length; i++) if (Number.isFinite(z[i])) abs.push(Math.abs(z[i]));
  abs.sort((a, b) => a - b);
  const k95 = Math.min(3, Math.max(0.5, quantileSorted(abs, 0.95) / Z95));
  return { k80: (base.k80 * k95) / base.k95, k95, hours: base.hours };
}
