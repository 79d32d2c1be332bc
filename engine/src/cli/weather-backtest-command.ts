/**
 * `npm run backtest -- --input load.csv --temperature temperature.csv [--temperature-forecasts F]
 * [--calendar special-days.csv] [--time-zone TZ] ...`: the rolling day-ahead backtest of the
 * pipeline with weather (engine weatherBacktest), each origin given only what was known at its
 * issue time; beside the model the weekly seasonal-naive baseline and the same model fed the
 * observed temperature ("perfect weather").
 */
import { weatherBacktest } from '@morrowline/engine';
import { HourlySeries } from './csv-series';
import { WeatherInputs } from './weather-inputs';

export function weatherBacktestReport(
  input: string,
  series: HourlySeries,
  w: WeatherInputs,
  o: { days: number; issueHour?: number; dayStarts: number[]; reselectEvery?: number },
): { text: string; json: Record<string, unknown> } {
  const r = weatherBacktest(series.values, {
    days: o.days,
    issueHour: o.issueHour,
    dayStarts: o.dayStarts,
    temperature: w.temperature,
    vintages: w.vintages,
    calendar: w.calendar,
    reselectEveryDays: o.reselectEvery,
  });
  if (!r.days.length) throw new Error('no day could be scored: the file needs at least three weeks of history before the scored days');
  const rows = r.days.map((d) => ({
    date: w.localDays[d.dayStart],
    hours: d.hours,
    issuedAtIndex: d.origin,
    model: d.model,
    ...(d.fallbackReason ? { fallbackReason: d.fallbackReason } : {}),
    mape: d.accuracy.mape,
    mae: d.accuracy.mae,
    bias: d.accuracy.bias,
    coverage80: d.accuracy.coverage80,
    coverage95: d.accuracy.coverage95,
    baselineMape: d.baseline.mape,
    perfectWeatherMape: d.perfectWeather.mape,
    temperatureVintageIssuedAtIndex: Number.isFinite(d.vintageIssued) ? d.vintageIssued : null,
    fitMs: d.fitMs,
  }));
  const json = {
    input,
    method: 'auto with weather',
    issueHour: o.issueHour ?? null,
    days: rows,
    mape: r.mape,
    mae: r.mae,
    rmse: r.rmse,
    bias: r.bias,
    peakError: r.peakError,
    coverage80: r.coverage80,
    coverage95: r.coverage95,
    coverage: { p80: r.coverage80, p95: r.coverage95 },
    baseline: r.baseline,
    perfectWeather: r.perfectWeather,
    improvement: r.improvement,
    timings: r.timings,
  };
  const f = (v: number, d = 2) => (Number.isFinite(v) ? v.toFixed(d) : 'n/a');
  const lines = [
    `${input}: backtest of ${rows.length} days with weather, ${o.issueHour === undefined ? 'issued at midnight' : `issued at ${o.issueHour}:00 the day before`}, on the temperature forecast known at each issue time`,
    '',
    'date        model                                                          MAPE%  cov80  cov95  naive MAPE%  perfect-weather MAPE%    ms',
    ...rows.map((d) => `${d.date}  ${d.model.padEnd(62).slice(0, 62)} ${f(d.mape).padStart(6)} ${f(d.coverage80).padStart(6)} ${f(d.coverage95).padStart(6)} ${f(d.baselineMape).padStart(12)} ${f(d.perfectWeatherMape).padStart(22)} ${f(d.fitMs, 0).padStart(5)}`),
    '',
    `mean            model  MAPE ${f(r.mape)} %   MAE ${f(r.mae)} MW   RMSE ${f(r.rmse)} MW   coverage 80 % ${f(100 * r.coverage80, 1)} %, 95 % ${f(100 * r.coverage95, 1)} %`,
    `perfect weather (same model on the observed temperature)  MAPE ${f(r.perfectWeather.mape)} %`,
    `baseline        weekly seasonal naive  MAPE ${f(r.baseline.mape)} %`,
    `improvement over the baseline: ${f(100 * r.improvement, 1)} % of its MAPE;   time ${f(r.timings.totalMs, 0)} ms in all, ${f(r.timings.meanFitMs, 0)} ms per origin`,
  ];
  return { text: lines.join('\n'), json };
}
