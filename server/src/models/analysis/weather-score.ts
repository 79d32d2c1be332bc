/**
 * The short backtest that scores a model version with weather terms: its terms, thresholds,
 * differencing and orders kept, β and the ARMA re-estimated at each origin (as `scoreChoice` does
 * for a version without weather), and each day forecast on the temperature forecast as it was
 * known at that day's origin. Rolling origins that never peek (Tashman 2000): each origin sees a
 * copy of the data cut at its issue time — the load and observed temperature of the hours that
 * ended by then and the vintages issued by then (the engine's `cutAt`) — and the calendar, known
 * in advance. Days and origins are those of `scoreChoice` (the last N whole days on the
 * history's 24-hour grid, each issued at its start), so the two scores, and the week-earlier
 * baseline beside them, are over the same hours.
 */
import {
  accuracy,
  cutAt,
  runWeatherPipeline,
  seasonalNaive,
  summarize,
  withExcluded,
  type Accuracy,
  type CalendarHours,
  type PipelineOptions,
  type WeatherChoice,
} from '@morrowline/engine';
import type { RefitWeather, ScoreResult } from './refit';

/** Hours of history each origin's fit may use: the engine's backtest window (8 weeks). */
const WINDOW_HOURS = 8 * 168;
/** The engine's backtest needs three weeks before the first origin. */
const MIN_ORIGIN = 3 * 168;

function sliceCalendar(c: CalendarHours, from: number, to: number): CalendarHours {
  const s = (a: ArrayLike<number>) => Float64Array.from({ length: to - from }, (_, i) => a[from + i] ?? NaN);
  return { hourOfDay: s(c.hourOfDay), holiday: s(c.holiday), bridge: s(c.bridge), ...(c.weekday ? { weekday: s(c.weekday) } : {}) };
}

const finiteOrNull = (v: number): number | null => (Number.isFinite(v) ? v : null);

/** Whether a stored choice carries weather or calendar terms (a choice without them is scored as before). */
export function hasWeatherTerms(choice: WeatherChoice | null | undefined): choice is WeatherChoice {
  return !!choice && (choice.terms.temperature || choice.terms.recency || choice.terms.calendar);
}

export interface WeatherScoreOptions {
  /** the engine's pipeline options of the error model (screening, seasonal block) */
  pipeline?: PipelineOptions;
}

/** Rolling day-ahead backtest of a version with weather on forecast weather known at each origin. */
export function scoreWeatherChoice(values: Float64Array, excluded: number[], weather: RefitWeather, choice: WeatherChoice, days: number, o: WeatherScoreOptions = {}): ScoreResult {
  const y = withExcluded(values, excluded);
  const n = y.length;
  const first = Math.max(0, Math.floor(n / 24) - days);
  const model: Accuracy[] = [];
  const baseline: Accuracy[] = [];
  const scored: number[] = [];
  for (let d = first; (d + 1) * 24 <= n; d++) {
    const origin = d * 24;
    if (origin < MIN_ORIGIN) continue;
    const from = Math.max(0, origin - WINDOW_HOURS);
    const known = cutAt(weather.temperature, weather.vintages, from, origin);
    const history = y.subarray(from, origin);
    const r = runWeatherPipeline({
      history,
      horizon: 24,
      temperature: known.temperature,
      vintages: known.vintages,
      calendar: sliceCalendar(weather.calendar, from, origin + 24),
      issuedAt: origin - from,
      options: { pipeline: { ...o.pipeline, computeSe: false, requireBeatBaseline: false }, requireBeatBaseline: false, fixed: choice },
    });
    const actual = y.subarray(origin, origin + 24);
    model.push(accuracy(actual, r.forecast));
    baseline.push(accuracy(actual, seasonalNaive(history, 24)));
    scored.push(origin);
  }
  const s = summarize(model);
  const b = summarize(baseline);
  return {
    mape: finiteOrNull(s.mape),
    baselineMape: finiteOrNull(b.mape),
    coverage80: finiteOrNull(s.coverage80),
    coverage95: finiteOrNull(s.coverage95),
    days: scored.length,
    from: scored.length ? scored[0] : null,
    to: scored.length ? scored[scored.length - 1] + 24 : null,
    onForecastWeather: true,
  };
}
