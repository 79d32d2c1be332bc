/**
 * Rolling-origin day-ahead backtest of the pipeline with weather (./weather-pipeline), never
 * peeking (Tashman 2000 on rolling origins): each origin's forecast is made from a copy of the
 * data cut at its issue time, so nothing it is given could have been known later — the load and
 * the observed temperature of the hours that ended by then, the temperature forecast vintages
 * issued by then (./weather/vintages), and the calendar (known in advance). Beside the model it scores
 * the weekly seasonal-naive forecast issued at the same time and the same fitted model fed the
 * temperature that was then observed ("perfect weather"), so the share of the error that is the
 * weather forecast's can be seen. Between full choices (every `reselectEveryDays` days) the terms,
 * thresholds and orders are kept and β and the ARMA re-estimated, as the desk's hourly updates
 * keep the nightly refit's orders.
 */
import { accuracy, Accuracy } from './metrics';
import { IntervalForecast } from './forecast';
import { PipelineOptions } from './pipeline';
import { seasonalNaive } from './seasonal-naive';
import { toSeries, withExcluded } from './series/series';
import { BacktestSummary, summarize } from './backtest';
import { CalendarHours } from './weather/load-terms';
import { TemperatureVintage } from './weather/vintages';
import { runWeatherPipeline, WeatherChoice, WeatherPipelineOptions } from './weather-pipeline';

export interface WeatherBacktestOptions {
  days: number;
  /** forecast issued at this hour of the day before each target day (default: at the day's start) */
  issueHour?: number;
  dayStarts?: number[];
  excluded?: Iterable<number>;
  /** observed temperature on the load's timeline */
  temperature: ArrayLike<number>;
  vintages?: readonly TemperatureVintage[];
  calendar?: CalendarHours;
  /** hours of history each fit may use (default 8 weeks) */
  windowHours?: number;
  /** choose terms and orders again every k days (default 7) */
  reselectEveryDays?: number;
  pipeline?: PipelineOptions;
  weather?: Omit<WeatherPipelineOptions, 'fixed' | 'pipeline'>;
}

export interface WeatherBacktestDay {
  dayStart: number;
  hours: number;
  origin: number;
  model: string;
  fallbackReason?: string;
  fitMs: number;
  accuracy: Accuracy;
  baseline: Accuracy;
  perfectWeather: Accuracy;
  forecast: IntervalForecast;
  /** issue time of the temperature vintage the forecast used (hours on the load's timeline; NaN none) */
  vintageIssued: number;
}

export interface WeatherBacktestResult extends BacktestSummary {
  days: WeatherBacktestDay[];
  baseline: BacktestSummary;
  perfectWeather: BacktestSummary;
  improvement: number;
  timings: { totalMs: number; meanFitMs: number; maxFitMs: number };
}

function sliceCalendar(c: CalendarHours, from: number, to: number): CalendarHours {
  const s = (a: ArrayLike<number>) => Float64Array.from({ length: to - from }, (_, i) => a[from + i] ?? NaN);
  return { hourOfDay: s(c.hourOfDay), holiday: s(c.holiday), bridge: s(c.bridge), ...(c.weekday ? { weekday: s(c.weekday) } : {}) };
}

/** The data as known at `origin`, on a timeline starting at `from`. */
export function cutAt(temperature: ArrayLike<number>, vintages: readonly TemperatureVintage[], from: number, origin: number): { temperature: Float64Array; vintages: TemperatureVintage[] } {
  const t = toSeries(Array.prototype.slice.call(temperature, from, origin) as number[]);
  const v = vintages.filter((x) => x.issued <= origin).map((x) => ({ issued: x.issued - from, first: x.first - from, members: x.members }));
  return { temperature: t, vintages: v };
}

export function weatherBacktest(values: ArrayLike<number>, o: WeatherBacktestOptions): WeatherBacktestResult {
  const t0 = performance.now();
  const y = withExcluded(values, o.excluded);
  const n = y.length;
  const T = toSeries(o.temperature);
  const window = o.windowHours ?? 8 * 168;
  const starts = o.dayStarts ?? Array.from({ length: Math.floor(n / 24) + 1 }, (_, i) => i * 24);
  const days: Array<[number, number]> = [];
  for (let i = 0; i + 1 < starts.length; i++) if (starts[i + 1] <= n) days.push([starts[i], starts[i + 1]]);
  const target = days.slice(Math.max(0, days.length - o.days));
  const every = Math.max(1, o.reselectEveryDays ?? 7);
  const out: WeatherBacktestDay[] = [];
  let fixed: WeatherChoice | undefined;
  let since = Infinity;
  for (const [ds, de] of target) {
    const prevIdx = days.findIndex((d) => d[0] === ds) - 1;
    const prevStart = prevIdx >= 0 ? days[prevIdx][0] : ds - 24;
    const origin = o.issueHour === undefined ? ds : Math.min(ds, prevStart + o.issueHour);
    if (origin < 168 * 3) continue;
    const from = Math.max(0, origin - window);
    const h = de - origin;
    const lead = ds - origin;
    const known = cutAt(T, o.vintages ?? [], from, origin);
    const reselect = !fixed || since >= every;
    const r = runWeatherPipeline({
      history: y.subarray(from, origin),
      horizon: h,
      temperature: known.temperature,
      vintages: known.vintages,
      calendar: o.calendar ? sliceCalendar(o.calendar, from, de) : undefined,
      scenarios: [{ name: 'observed', temperature: Array.from({ length: h }, (_, j) => T[origin + j]) }],
      options: { ...o.weather, pipeline: { ...o.pipeline, computeSe: false }, fixed: reselect ? undefined : fixed },
    });
    if (reselect) since = 0;
    since++;
    if (r.choice) fixed = r.choice;
    const cut = (f: IntervalForecast): IntervalForecast => ({
      mean: f.mean.slice(lead),
      se: f.se.slice(lead),
      lower80: f.lower80.slice(lead),
      upper80: f.upper80.slice(lead),
      lower95: f.lower95.slice(lead),
      upper95: f.upper95.slice(lead),
    });
    const actual = y.subarray(ds, de);
    const f = cut(r.forecast);
    const perfect = r.scenarios.length ? cut(r.scenarios[0].forecast) : f;
    out.push({
      dayStart: ds,
      hours: de - ds,
      origin,
      model: r.description,
      fallbackReason: r.fallbackReason,
      fitMs: r.timings.totalMs,
      accuracy: accuracy(actual, f),
      baseline: accuracy(actual, cut(seasonalNaive(y.subarray(from, origin), h))),
      perfectWeather: accuracy(actual, perfect),
      forecast: f,
      vintageIssued: r.vintageIssued + from,
    });
  }
  const s = summarize(out.map((d) => d.accuracy));
  const baseline = summarize(out.map((d) => d.baseline));
  const fits = out.map((d) => d.fitMs);
  return {
    days: out,
    ...s,
    baseline,
    perfectWeather: summarize(out.map((d) => d.perfectWeather)),
    improvement: 1 - s.mape / baseline.mape,
    timings: {
      totalMs: performance.now() - t0,
      meanFitMs: fits.length ? fits.reduce((a, b) => a + b, 0) / fits.length : 0,
      maxFitMs: fits.length ? Math.max(...fits) : 0,
    },
  };
}
