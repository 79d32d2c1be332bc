/**
 * `npm run fit -- --input load.csv --temperature temperature.csv [--temperature-forecasts F]
 * [--calendar special-days.csv] [--time-zone TZ]`: the pipeline with weather on the whole file
 * (engine runWeatherPipeline), issued when the last load hour ended; prints the terms chosen and
 * why (each candidate's backtest MAPE), the response coefficients with their standard errors
 * beside the error model's coefficients, and the next 24 hours' forecast with the temperature it
 * was issued on.
 */
import { runWeatherPipeline } from '@morrowline/engine';
import { HourlySeries } from './csv-series';
import { WeatherInputs } from './weather-inputs';

export function weatherFitReport(input: string, series: HourlySeries, w: WeatherInputs): { text: string; json: Record<string, unknown> } {
  const y = series.values;
  const r = runWeatherPipeline({ history: y, horizon: 24, temperature: w.temperature, vintages: w.vintages, calendar: w.calendar });
  const json = {
    input,
    hours: y.length,
    missingHours: series.missing,
    method: r.method,
    ...(r.fallbackReason ? { fallbackReason: r.fallbackReason } : {}),
    model: r.description,
    terms: r.choice?.terms ?? null,
    candidates: r.candidates.map((c) => ({ terms: c.label, mape: c.mape, ...(c.error ? { error: c.error } : {}) })),
    response: r.response,
    coefficients: r.errorModel?.coefficients ?? [],
    sigma2: r.errorModel?.sigma2 ?? null,
    loglik: r.errorModel?.loglik ?? null,
    aicc: r.errorModel?.aicc ?? null,
    baselineMape: r.baselineMape,
    bandScale: r.bandScale,
    forecast: r.forecast,
    temperature: r.temperature,
    weatherSd: r.weatherSd,
    fitMs: r.timings.totalMs,
  };
  const f = (v: number, d = 4) => (Number.isFinite(v) ? v.toFixed(d) : 'n/a');
  const lines = [
    `${input}: ${y.length} hours, ${series.missing} missing; with the observed temperature${w.vintages.length ? ` and ${w.vintages.length} forecast vintages` : ' (no forecast vintages: the forecast hours take the temperature 24 hours earlier)'}`,
    `model: ${r.description}${r.fallbackReason ? `   [${r.fallbackReason}]` : ''}`,
    '',
    'terms tried (mean daily MAPE of day-ahead forecasts on forecast weather over the last days)',
    ...r.candidates.map((c) => `  ${c.label.padEnd(80)} ${f(c.mape, 2)} %`),
    '',
    'coefficient          estimate      std.error',
    ...(r.errorModel?.coefficients ?? []).map((c) => `${c.name.padEnd(16)} ${f(c.value).padStart(12)}   ${f(c.se).padStart(12)}`),
    ...r.response.map((c) => `${c.name.padEnd(16)} ${f(c.value).padStart(12)}   ${f(c.se).padStart(12)}   MW per unit`),
    '',
    `sigma2 ${f(r.errorModel?.sigma2 ?? NaN)}   loglik ${f(r.errorModel?.loglik ?? NaN, 2)}   AICc ${f(r.errorModel?.aicc ?? NaN, 2)}   (standard errors of the response: least squares on the weekly difference)`,
    `time ${f(r.timings.totalMs, 0)} ms`,
  ];
  return { text: lines.join('\n'), json };
}
