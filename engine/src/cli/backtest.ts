/**
 * `npm run backtest -- --input FILE.csv [--days N] [--issue-hour H]
 *  [--method auto|seasonal-naive|fixed] [--diff 24,168 --order p,q] [--json]` (`--help` prints the usage)
 * Rolling day-ahead backtest over the last N operating days (default 14) with the weekly
 * seasonal-naive baseline beside the model. Without --issue-hour each origin is a local
 * midnight and the forecast is the 24 (23/25) hours that follow it; with --issue-hour H the
 * forecast is issued at H:00 of the day before.
 */
import { readFileSync } from 'node:fs';
import { parseArgs } from 'node:util';
import { localDate, parseLoadCsv } from './csv-series';
import { parseIntList } from './fit';
import { backtest, BacktestMethod } from '@morrowline/engine';
import { dayStartsIn, readWeatherInputs, WEATHER_OPTIONS } from './weather-inputs';
import { weatherBacktestReport } from './weather-backtest-command';

const USAGE = 'usage: npm run backtest -- --input FILE.csv [--days N] [--issue-hour H] [--method auto|seasonal-naive|fixed --diff 24,168 --order p,q] [--temperature FILE.csv [--temperature-forecasts FILE.csv] [--calendar FILE.csv]] [--time-zone TZ] [--json]';

export function runBacktest(argv: string[]): { text: string; json: Record<string, unknown> } {
  const { values: a } = parseArgs({
    args: argv,
    options: {
      input: { type: 'string' },
      days: { type: 'string' },
      'issue-hour': { type: 'string' },
      method: { type: 'string' },
      diff: { type: 'string' },
      order: { type: 'string' },
      'reselect-every': { type: 'string' },
      ...WEATHER_OPTIONS,
      json: { type: 'boolean' },
      help: { type: 'boolean', short: 'h' },
    },
    strict: true,
  });
  if (a.help) return { text: USAGE, json: { usage: USAGE } };
  if (!a.input) throw new Error(`--input is required\n${USAGE}`);
  const days = a.days === undefined ? 14 : Number(a.days);
  if (!Number.isInteger(days) || days < 1) throw new Error(`--days must be a positive integer, got "${a.days}"`);
  let issueHour: number | undefined;
  if (a['issue-hour'] !== undefined) {
    issueHour = Number(a['issue-hour']);
    if (!Number.isInteger(issueHour) || issueHour < 0 || issueHour > 23) throw new Error(`--issue-hour must be an hour 0..23, got "${a['issue-hour']}"`);
  }
  const methodName = a.method ?? 'auto';
  let method: BacktestMethod;
  if (methodName === 'auto' || methodName === 'seasonal-naive') method = methodName;
  else if (methodName === 'fixed' || methodName === 'arima') {
    if (!a.diff || !a.order) throw new Error('--method fixed needs --diff and --order');
    const order = parseIntList(a.order, 'order', 2);
    method = { diff: a.diff === 'none' ? [] : parseIntList(a.diff, 'diff'), p: order[0], q: order[1] };
  } else throw new Error(`--method must be auto, seasonal-naive or fixed, got "${methodName}"`);
  const series = parseLoadCsv(readFileSync(a.input, 'utf8'));
  const dayStarts = a['time-zone'] ? dayStartsIn(series, a['time-zone']) : series.dayStarts;
  const weather = readWeatherInputs(a, series, 0);
  if (weather) {
    if (methodName !== 'auto') throw new Error('--temperature backtests the automatic pipeline with weather; --method must be auto');
    return weatherBacktestReport(a.input, series, weather, { days, issueHour, dayStarts, reselectEvery: a['reselect-every'] ? Number(a['reselect-every']) : undefined });
  }
  const r = backtest(series.values, {
    days,
    method,
    issueHour,
    dayStarts,
    reselectEveryDays: a['reselect-every'] ? Number(a['reselect-every']) : undefined,
  });
  if (!r.days.length) throw new Error('no day could be scored: the file needs at least three weeks of history before the scored days');
  const rows = r.days.map((d) => ({
    date: localDate(series, d.dayStart),
    hours: d.hours,
    issuedAtIndex: d.origin,
    model: d.model,
    ...(d.fallbackReason ? { fallbackReason: d.fallbackReason } : {}),
    mape: d.accuracy.mape,
    mae: d.accuracy.mae,
    rmse: d.accuracy.rmse,
    bias: d.accuracy.bias,
    peakError: d.accuracy.peakError,
    coverage80: d.accuracy.coverage80,
    coverage95: d.accuracy.coverage95,
    baselineMape: d.baseline.mape,
    fitMs: d.fitMs,
  }));
  const json = {
    input: a.input,
    method: r.method,
    issueHour: issueHour ?? null,
    days: rows,
    mape: r.mape,
    mae: r.mae,
    rmse: r.rmse,
    bias: r.bias,
    peakError: r.peakError,
    coverage80: r.coverage80,
    coverage95: r.coverage95,
    /** shares of the scored hours inside the 80 % and 95 % bands (0..1) */
    coverage: { p80: r.coverage80, p95: r.coverage95 },
    baseline: r.baseline,
    improvement: r.improvement,
    timings: r.timings,
  };
  const f = (v: number, d = 2) => (Number.isFinite(v) ? v.toFixed(d) : 'n/a');
  const lines = [
    `${a.input}: backtest of ${rows.length} days, method ${r.method}, ${issueHour === undefined ? 'issued at midnight' : `issued at ${issueHour}:00 the day before`}`,
    '',
    'date        hours  model                          MAPE%   MAE MW   bias MW  peak MW  cov80  cov95  naive MAPE%  ms',
    ...rows.map(
      (d) =>
        `${d.date}  ${String(d.hours).padStart(5)}  ${d.model.padEnd(30).slice(0, 30)} ${f(d.mape).padStart(6)} ${f(d.mae).padStart(8)} ${f(d.bias).padStart(9)} ${f(d.peakError).padStart(8)} ${f(d.coverage80).padStart(6)} ${f(d.coverage95).padStart(6)} ${f(d.baselineMape).padStart(12)} ${f(d.fitMs, 0).padStart(4)}`,
    ),
    '',
    `mean        model  MAPE ${f(r.mape)} %   MAE ${f(r.mae)} MW   RMSE ${f(r.rmse)} MW   bias ${f(r.bias)} MW   peak ${f(r.peakError)} MW   coverage 80 % ${f(100 * r.coverage80, 1)} %, 95 % ${f(100 * r.coverage95, 1)} %`,
    `baseline    weekly seasonal naive  MAPE ${f(r.baseline.mape)} %   MAE ${f(r.baseline.mae)} MW   RMSE ${f(r.baseline.rmse)} MW   bias ${f(r.baseline.bias)} MW   peak ${f(r.baseline.peakError)} MW`,
    `improvement over the baseline: ${f(100 * r.improvement, 1)} % of its MAPE;   time ${f(r.timings.totalMs, 0)} ms in all, ${f(r.timings.meanFitMs, 0)} ms per origin`,
  ];
  return { text: lines.join('\n'), json };
}

if (require.main === module) {
  try {
    const argv = process.argv.slice(2);
    const r = runBacktest(argv);
    process.stdout.write((argv.includes('--json') ? JSON.stringify(r.json, null, 2) : r.text) + '\n');
  } catch (e) {
    process.stderr.write(`backtest: ${(e as Error).message}\n`);
    process.exit(1);
  }
}
