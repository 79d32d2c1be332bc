/**
 * `npm run fit -- --input FILE.csv [--diff 24,168] [--order p,q] [--seasonal P,Q,s]
 *  [--mean|--no-mean] [--xreg REGRESSORS.csv] [--repeat N] [--json]` (`--help` prints the usage)
 * With --xreg (`timestamp,NAME1,NAME2,…`, one row per hour of the load) the model is a
 * regression with ARMA errors on those columns, fitted as given (fit-xreg.ts).
 * Fits a model to an hourly load history and prints coefficients with standard errors, σ²,
 * log-likelihood, AIC, AICc, BIC, Ljung–Box at lags 24 and 48, n and the estimation time.
 * Without --order the orders are chosen by AICc (p, q ≤ 3); without --diff and --order the
 * whole automatic pipeline chooses the differencing too. `--diff none` fits without differencing.
 * `--repeat N` fits the chosen model N times in this one process: `firstFitMs` is the first
 * (cold: the JIT has not compiled the engine yet), `fitMs` the median of the other N − 1, timed
 * after an untimed warm-up (`warmUpFits` of them, as the benchmarks warm up: warm-timing.ts), so
 * that they are warm as in a long-running server; with N = 1 both are the one fit.
 */
import { readFileSync } from 'node:fs';
import { parseArgs } from 'node:util';
import { parseLoadCsv } from './csv-series';
import { runXregFit } from './fit-xreg';
import { difference, describeDifferencing, fitArima, ljungBox, runPipeline, selectOrder, ArimaFit } from '@morrowline/engine';
import { readWeatherInputs, WEATHER_OPTIONS } from './weather-inputs';
import { repeatedTime, timeRepeated } from './warm-timing';
import { weatherFitReport } from './weather-fit-command';

const USAGE =
  'usage: npm run fit -- --input FILE.csv [--diff 24,168|none] [--order p,q] [--seasonal P,Q,s] [--mean|--no-mean] [--xreg REGRESSORS.csv (with --order)] [--repeat N] [--temperature FILE.csv [--temperature-forecasts FILE.csv] [--calendar FILE.csv] [--time-zone TZ]] [--json]';

const START_LABELS: Record<ArimaFit['arma']['startedFrom'], string> = {
  given: 'given',
  'hannan-rissanen': 'Hannan–Rissanen',
  moments: 'method-of-moments',
  zero: 'all-zero',
  opposed: 'opposed AR/MA',
  'ma-unit-root': 'MA near its unit root',
  'ma-circle': 'MA roots near the unit circle',
  'ar-unit-root': 'AR near its unit root',
  'seasonal-unit-root': 'seasonal MA near its unit root',
  css: 'conditional-sum-of-squares',
  'css-free-ma': 'conditional-sum-of-squares, MA unconstrained',
  'natural-ma': 'exact likelihood with the MA part unconstrained, from zero',
};

export function parseIntList(s: string, name: string, len?: number): number[] {
  const v = s.split(',').map((x) => x.trim());
  if ((len !== undefined && v.length !== len) || v.some((x) => !/^\d+$/.test(x))) {
    throw new Error(`--${name} expects ${len ?? 'a list of'} non-negative integers separated by commas, got "${s}"`);
  }
  return v.map(Number);
}

export function runFit(argv: string[]): { text: string; json: Record<string, unknown> } {
  const { values: a } = parseArgs({
    args: argv,
    options: {
      input: { type: 'string' },
      diff: { type: 'string' },
      order: { type: 'string' },
      seasonal: { type: 'string' },
      mean: { type: 'boolean' },
      'no-mean': { type: 'boolean' },
      repeat: { type: 'string' },
      xreg: { type: 'string' },
      ...WEATHER_OPTIONS,
      json: { type: 'boolean' },
      help: { type: 'boolean', short: 'h' },
    },
    strict: true,
  });
  if (a.help) return { text: USAGE, json: { usage: USAGE } };
  if (!a.input) throw new Error(`--input is required\n${USAGE}`);
  if (a.mean && a['no-mean']) throw new Error('--mean and --no-mean exclude each other');
  if (a.repeat !== undefined && !/^[1-9]\d{0,3}$/.test(a.repeat)) throw new Error(`--repeat expects a whole number from 1 to 9999, got "${a.repeat}"`);
  const repeat = a.repeat === undefined ? 1 : Number(a.repeat);
  const series = parseLoadCsv(readFileSync(a.input, 'utf8'));
  const weather = readWeatherInputs(a, series, 24);
  if (weather) {
    if (a.xreg) throw new Error('--xreg fits the columns given; --temperature chooses the weather terms itself: use one or the other');
    if (a.diff || a.order || a.seasonal || a.mean || a['no-mean'] || a.repeat) throw new Error('--temperature fits the automatic pipeline with weather; --diff, --order, --seasonal, --mean and --repeat do not apply');
    return weatherFitReport(a.input, series, weather);
  }
  const y = series.values;
  let diff: number[] | undefined;
  if (a.diff !== undefined) diff = a.diff === 'none' || a.diff === '0' ? [] : parseIntList(a.diff, 'diff').filter((d) => d > 0);
  let order = a.order ? parseIntList(a.order, 'order', 2) : undefined;
  const seasonal = a.seasonal ? parseIntList(a.seasonal, 'seasonal', 3) : undefined;
  const includeMean = a.mean ? true : a['no-mean'] ? false : undefined;
  if (a.xreg) return runXregFit({ input: a.input, series, xreg: a.xreg, diff: diff ?? [], order, seasonal, includeMean, repeat });
  let chosenBy = 'given';
  let pipelineMs: number | undefined;
  if (!diff && !order) {
    const t = performance.now();
    const r = runPipeline({ history: y, horizon: 24 });
    pipelineMs = performance.now() - t;
    if (!r.model) throw new Error(`no model could be fitted: ${r.fallbackReason}`);
    diff = r.model.diff;
    order = [r.model.p, r.model.q];
    chosenBy = 'automatic pipeline (differencing by short backtest, orders by AICc)';
  }
  diff = diff ?? [];
  if (!order) {
    const sel = selectOrder(difference(y, diff), {
      includeMean: includeMean ?? diff.length === 0,
      P: seasonal?.[0],
      Q: seasonal?.[1],
      period: seasonal?.[2],
      computeSe: false,
    });
    order = [sel.best.spec.p, sel.best.spec.q];
    chosenBy = 'AICc over p, q ≤ 3';
  }
  const spec = { diff, p: order[0], q: order[1], P: seasonal?.[0], Q: seasonal?.[1], period: seasonal?.[2], includeMean };
  let fit: ArimaFit | undefined;
  const timing = timeRepeated(() => {
    fit = fitArima(y, spec);
  }, repeat);
  const m = (fit as ArimaFit).arma;
  const { firstMs: firstFitMs, warmMs: fitMs } = timing;
  const fitdf = m.spec.p + m.spec.q + m.spec.P + m.spec.Q;
  const lb = [24, 48].map((lag) => ljungBox(m.residuals, lag, fitdf));
  const json = {
    input: a.input,
    hours: y.length,
    missingHours: series.missing,
    diff,
    differencing: describeDifferencing(diff),
    order: { p: m.spec.p, q: m.spec.q },
    seasonal: m.spec.P + m.spec.Q > 0 ? { P: m.spec.P, Q: m.spec.Q, period: m.spec.period } : null,
    includeMean: m.spec.includeMean,
    chosenBy,
    coefficients: m.coefficients,
    sigma2: m.sigma2,
    loglik: m.loglik,
    aic: m.aic,
    aicc: m.aicc,
    bic: m.bic,
    ljungBox: lb,
    n: m.nUsed,
    converged: m.converged,
    startedFrom: m.startedFrom,
    fitMs,
    firstFitMs,
    fits: repeat,
    warmUpFits: timing.warmUp,
    ...(pipelineMs !== undefined ? { selectionMs: pipelineMs } : {}),
  };
  const f = (v: number, d = 4) => (Number.isFinite(v) ? v.toFixed(d) : 'n/a');
  const lines = [
    `${a.input}: ${y.length} hours, ${series.missing} missing`,
    `model: ${describeDifferencing(diff)} then ARMA(${m.spec.p},${m.spec.q})${json.seasonal ? `×(${m.spec.P},${m.spec.Q})_${m.spec.period}` : ''}${m.spec.includeMean ? ' with mean' : ''}  [${chosenBy}]`,
    '',
    'coefficient      estimate      std.error',
    ...m.coefficients.map((c) => `${c.name.padEnd(12)} ${f(c.value).padStart(12)}   ${f(c.se).padStart(12)}`),
    '',
    `sigma2 ${f(m.sigma2)}   loglik ${f(m.loglik, 2)}   AIC ${f(m.aic, 2)}   AICc ${f(m.aicc, 2)}   BIC ${f(m.bic, 2)}`,
    ...lb.map((l) => `Ljung–Box lag ${l.lag}: Q ${f(l.statistic, 2)} on ${l.df} df, p ${f(l.pValue, 4)}`),
    `n ${m.nUsed}   estimation ${repeatedTime(timing, repeat)}, search kept: from the ${START_LABELS[m.startedFrom]} start${m.converged ? '' : '   (optimiser did not fully converge)'}`,
  ];
  return { text: lines.join('\n'), json };
}

if (require.main === module) {
  try {
    const argv = process.argv.slice(2);
    const r = runFit(argv);
    process.stdout.write((argv.includes('--json') ? JSON.stringify(r.json, null, 2) : r.text) + '\n');
  } catch (e) {
    process.stderr.write(`fit: ${(e as Error).message}\n`);
    process.exit(1);
  }
}
