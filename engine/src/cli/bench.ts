/**
 * Engine benchmark (not a test): `npm run bench`, which runs the compiled `dist/cli/bench.js` (the
 * code a server runs; under tsx the timings of the same fits varied several-fold between runs).
 *  0. the real-series table first (bench-real.ts): the open demand series under each differencing
 *     the pipeline considers, every order p, q ≤ 3 with and without a seasonal block at 24,
 *     against R in the same run (`--real-only` runs this table alone, `--no-real` leaves it out,
 *     `--pipeline-only` runs parts 2 and 4 alone), then R's own real datasets with means, long
 *     cycles and seasonal differencing the same way (bench-datasets.ts);
 *  1. exact-ML ARMA fits (with standard errors) on 2,000 and 8,760 hourly points, median wall
 *     time, on simulated ARMA(2,1) series (φ = 0.6, −0.2; θ = 0.4), several orders;
 *  2. the automatic pipeline on eight weeks (1,344 h) of the real demand fixture;
 *  3. where Rscript exists, the same fits timed in R (stats::arima, CSS-ML) in the same run,
 *     with the speed ratio and the log-likelihood difference;
 *  4. day-ahead accuracy on the real demand data (R forecast's `taylor`, England & Wales, hourly
 *     means): the automatic pipeline vs the weekly seasonal-naive forecast and vs R's arima with
 *     the same differencing and orders at every origin; then the last 7, 14 and 28 days of that
 *     backtest (MAPE, 80 % and 95 % coverage) beside R's auto.arima with weekly seasonal
 *     differencing on the same origins (fixtures/r-auto-arima-backtest.json);
 *  5. `--weather-only [--seeds 1,2] [--data DIR]`: the pipeline with weather on the simulator's
 *     exported zones, winter and summer, beside the same pipeline without weather (bench-weather.ts);
 *  6. `--windows-only`: every order of the real-series table on eight-week windows of the demand
 *     series against R, the fits where the engine ends below R's best (bench-windows.ts);
 *  7. `--gaps-only`: the real-series table with a few hours of the demand series missing on both
 *     sides (bench-real.ts, BENCH_MISSING_HOURS), as real meter data has them.
 *  8. `--input FILE.csv` (an hourly load file as `npm run backtest` reads it): the real-series table
 *     alone on that series instead of the open demand fixture, the way a series nobody tuned the
 *     engine on is checked (missing hours stay missing on both sides).
 * Prints a table and the machine (CPU model, cores, Node and R versions).
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { cpus, tmpdir } from 'node:os';
import { basename, join, resolve } from 'node:path';
import { accuracy, backtest, describeModel, fitArma, median, runPipeline, type BacktestResult } from '@morrowline/engine';
import { simulateArma21 as simulate } from './bench-series';
import { BENCH_MISSING_HOURS, printRealTable, RealCase, realCases, RFitTiming, timeEngine, timeRealTable, withMissingHours } from './bench-real';
import { parseLoadCsv } from './csv-series';
import { runWeatherBench } from './bench-weather';
import { datasetCases, printDatasetTable, timeDatasets } from './bench-datasets';
import { fitWindows, printWindows, windowCases } from './bench-windows';

function valueOf(args: string[], name: string): string | undefined {
  const i = args.indexOf(name);
  return i >= 0 ? args[i + 1] : undefined;
}

// from src/cli (jest, tsx) or dist/cli (compiled, as `npm run bench` runs it): the fixtures stay in src
const FIX = [join(__dirname, '../fixtures'), join(__dirname, '../../src/fixtures')].find((d) => existsSync(d)) ?? '';

function hasR(): string | null {
  const r = spawnSync('Rscript', ['-e', 'cat(R.version.string)'], { encoding: 'utf8' });
  return r.status === 0 ? r.stdout.trim() : null;
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- R's JSON answer; the callers read the fields they asked R for
function runR(job: unknown): any {
  const dir = mkdtempSync(join(tmpdir(), 'bench-r-'));
  const f = join(dir, 'job.json');
  writeFileSync(f, JSON.stringify(job));
  const r = spawnSync('Rscript', [join(FIX, 'bench-r.R'), f], { encoding: 'utf8', maxBuffer: 1 << 28 });
  if (r.status !== 0) throw new Error(`Rscript failed: ${r.stderr}`);
  return JSON.parse(r.stdout);
}

/** 1. exact-ML fits on simulated series, against R's arima in the same run. */
function printSimulatedFits(rVersion: string | null): void {
  // 1. fits
  const series: Record<string, number[]> = { n2000: simulate(2000, 42), n8760: simulate(8760, 4242) };
  const orders: Array<[number, number]> = [
    [1, 0],
    [1, 1],
    [2, 1],
    [2, 2],
    [3, 3],
  ];
  const reps = 15;
  const rows: Array<{ id: string; series: string; p: number; q: number; ms: number; loglik: number; oneStartMs: number; oneStartLoglik: number }> = [];
  // Warm every case up before timing any: the JIT compiles the engine during the first few dozen
  // fits, and without this the first case timed pays for it (a long-running server is warm).
  for (let w = 0; w < 5; w++) for (const x of Object.values(series)) for (const [p, q] of orders) fitArma(x, { p, q, includeMean: false });
  for (const [key, x] of Object.entries(series)) {
    for (const [p, q] of orders) {
      const ts: number[] = [];
      let ll = NaN;
      for (let r = 0; r < reps; r++) {
        const t0 = performance.now();
        const f = fitArma(x, { p, q, includeMean: false });
        ts.push(performance.now() - t0);
        ll = f.loglik;
      }
      // orders fitted from two starts (p, q ≥ 2): the time and result of the first start alone
      const one: number[] = [];
      let oneLl = NaN;
      if (p >= 2 && q >= 2) {
        for (let r = 0; r < reps; r++) {
          const t0 = performance.now();
          const f = fitArma(x, { p, q, includeMean: false }, { secondStart: false });
          one.push(performance.now() - t0);
          oneLl = f.loglik;
        }
      }
      rows.push({ id: `${key}-${p}-${q}`, series: key, p, q, ms: median(ts), loglik: ll, oneStartMs: one.length ? median(one) : NaN, oneStartLoglik: oneLl });
    }
  }
  let rTiming: Record<string, { medianMs: number; loglik: number }> = {};
  if (rVersion) {
    const out = runR({ series, timing: rows.map((r) => ({ id: r.id, series: r.series, p: r.p, q: r.q, reps: 5 })) });
    rTiming = Object.fromEntries((out.timing as Array<{ id: string; medianMs: number; loglik: number }>).map((t) => [t.id, t]));
  }
  console.log('ARMA exact-ML fit (with standard errors), median of 15 runs; R: stats::arima CSS-ML, median of 5');
  console.log('(p, q ≥ 2 are searched from two starts; the last columns are the Hannan–Rissanen start alone)');
  console.log('points  order       engine ms   R ms     R/engine   loglik engine    loglik R   diff   | one start ms  loglik − R');
  for (const r of rows) {
    const rt = rTiming[r.id];
    console.log(
      `${(r.series === 'n2000' ? '2,000' : '8,760').padEnd(7)} ARMA(${r.p},${r.q})   ${fmt(r.ms).padStart(9)} ${rt ? fmt(rt.medianMs, 0).padStart(6) : '   n/a'}  ${rt ? fmt(rt.medianMs / r.ms, 1).padStart(8) : '     n/a'}   ${fmt(r.loglik, 3).padStart(13)} ${rt ? fmt(rt.loglik, 3).padStart(12) : 'n/a'} ${rt ? fmt(r.loglik - rt.loglik, 4).padStart(8) : ''}${Number.isFinite(r.oneStartMs) ? `   | ${fmt(r.oneStartMs).padStart(12)} ${rt ? fmt(r.oneStartLoglik - rt.loglik, 4).padStart(11) : ''}` : ''}`,
    );
  }
}

const fmt = (v: number, d = 2) => (Number.isFinite(v) ? v.toFixed(d) : 'n/a');

/** The real-series table on a load file of the caller's (`--input`), R in the same run. */
function runRealTableOn(file: string, rVersion: string | null): void {
  // npm runs the bench in engine/ (scripts/bench.sh): a relative path is the caller's, from where npm was invoked
  const series = parseLoadCsv(readFileSync(resolve(process.env.INIT_CWD ?? process.cwd(), file), 'utf8'));
  const load = Array.from(series.values);
  const cases = realCases();
  timeEngine(load, cases.filter((c) => c.P === 0).slice(0, 16));
  const fitR = (group: RealCase[]) => {
    const out = runR({ real: { load, cases: group.map((c) => ({ id: c.id, diff: [c.diff], p: c.p, q: c.q, P: c.P, Q: c.Q })) } });
    return new Map((out.real as Array<{ id: string; cssMl: RFitTiming; ml: RFitTiming }>).map((r) => [r.id, { cssMl: r.cssMl, ml: r.ml }]));
  };
  const missing = series.missing ? `, ${series.missing} missing` : '';
  printRealTable(timeRealTable(load, cases, rVersion ? fitR : null), console.log, [], `${basename(file)}, ${load.length} h${missing}`);
}

function main(): void {
  const cpu = (() => {
    try {
      return /model name\s*:\s*(.*)/.exec(readFileSync('/proc/cpuinfo', 'utf8'))?.[1] ?? cpus()[0]?.model;
    } catch {
      return cpus()[0]?.model;
    }
  })();
  const rVersion = hasR();
  console.log(`machine: ${cpu}, ${cpus().length} cores, Node ${process.version}${rVersion ? `, ${rVersion}` : ', R not found'}; ${new Date().toISOString().slice(0, 16)} UTC\n`);
  const args = process.argv.slice(2);
  const known = ['--real-only', '--no-real', '--pipeline-only', '--weather-only', '--windows-only', '--gaps-only'];
  const weatherSeeds = valueOf(args, '--seeds') ?? '1,2';
  const weatherData = valueOf(args, '--data') ?? join(tmpdir(), 'morrowline-bench-weather');
  const withValue = ['--seeds', '--data', '--input'];
  const unknown = args.filter((a, i) => !known.includes(a) && !withValue.includes(a) && !withValue.includes(args[i - 1]));
  if (unknown.length) throw new Error(`bench: unknown argument ${unknown[0]} (known: ${known.join(', ')})`);
  if (args.includes('--weather-only')) {
    if (!/^\d+(,\d+)*$/.test(weatherSeeds)) throw new Error(`bench: --seeds expects whole numbers separated by commas, got "${weatherSeeds}"`);
    runWeatherBench(weatherSeeds.split(',').map(Number), weatherData);
    return;
  }
  const input = valueOf(args, '--input');
  if (args.includes('--input')) {
    if (!input || input.startsWith('--')) throw new Error('bench: --input expects an hourly load file (timestamp,load_mw)');
    runRealTableOn(input, rVersion);
    return;
  }
  const taylorLoad = JSON.parse(readFileSync(join(FIX, 'taylor-hourly.json'), 'utf8')).load as number[];
  if (args.includes('--windows-only')) {
    const cases = windowCases();
    const rows = fitWindows(taylorLoad, cases);
    if (rVersion) {
      const out = runR({ windows: { load: taylorLoad, cases: cases.map((c) => ({ id: c.id, from: c.from, hours: c.hours, diff: [c.diff], p: c.p, q: c.q, P: c.P, Q: c.Q })) } });
      const num = (v: unknown): number => (typeof v === 'number' ? v : NaN);
      const byId = new Map((out.windows as Array<{ id: string; cssMl: unknown; ml: unknown }>).map((r) => [r.id, r]));
      for (const row of rows) {
        const r = byId.get(row.c.id);
        if (r) {
          row.rCssMl = num(r.cssMl);
          row.rMl = num(r.ml);
        }
      }
    }
    printWindows(rows);
    return;
  }
  if (args.includes('--gaps-only')) {
    // the real-series table again with a few hours missing, as real meter data has them
    const gappy = withMissingHours(taylorLoad);
    const cases = realCases();
    timeEngine(gappy, cases.filter((c) => c.P === 0).slice(0, 16));
    const fitR = (group: RealCase[]) => {
      const out = runR({ real: { load: gappy, cases: group.map((c) => ({ id: c.id, diff: [c.diff], p: c.p, q: c.q, P: c.P, Q: c.Q })) } });
      return new Map((out.real as Array<{ id: string; cssMl: RFitTiming; ml: RFitTiming }>).map((r) => [r.id, { cssMl: r.cssMl, ml: r.ml }]));
    };
    printRealTable(timeRealTable(gappy, cases, rVersion ? fitR : null), console.log, BENCH_MISSING_HOURS);
    return;
  }
  if (!args.includes('--no-real') && !args.includes('--pipeline-only')) {
    const cases = realCases();
    // warm the JIT on the first cases before any is timed (a long-running server is warm)
    timeEngine(taylorLoad, cases.filter((c) => c.P === 0).slice(0, 16));
    const fitR = (group: RealCase[]) => {
      const out = runR({ real: { load: taylorLoad, cases: group.map((c) => ({ id: c.id, diff: [c.diff], p: c.p, q: c.q, P: c.P, Q: c.Q })) } });
      return new Map((out.real as Array<{ id: string; cssMl: RFitTiming; ml: RFitTiming }>).map((r) => [r.id, { cssMl: r.cssMl, ml: r.ml }]));
    };
    const rows = timeRealTable(taylorLoad, cases, rVersion ? fitR : null);
    printRealTable(rows);
    console.log('');
    // the engine's fits first, then R's: each table is timed in a few seconds on both sides
    const datasets = datasetCases(JSON.parse(readFileSync(join(FIX, 'r-arima-real.json'), 'utf8')));
    const dsRows = timeDatasets(datasets);
    if (rVersion) {
      const out = runR({ datasets: datasets.map((c, i) => ({ id: i, x: c.x, order: c.order, seasonal: c.seasonal, period: c.period, includeMean: c.includeMean })) });
      (out.datasets as Array<{ id: number; cssMl: RFitTiming; ml: RFitTiming }>).forEach((r) => (dsRows[r.id].r = { cssMl: r.cssMl, ml: r.ml }));
    }
    printDatasetTable(dsRows);
    console.log('');
    if (args.includes('--real-only')) return;
  }

  if (!args.includes('--pipeline-only')) printSimulatedFits(rVersion);

  // 2. pipeline
  const taylor = JSON.parse(readFileSync(join(FIX, 'taylor-hourly.json'), 'utf8')).load as number[];
  const eight = taylor.slice(taylor.length - 8 * 168);
  const first = performance.now();
  runPipeline({ history: eight, horizon: 40 });
  const firstMs = performance.now() - first;
  const pts: number[] = [];
  let pr = runPipeline({ history: eight, horizon: 40 });
  for (let i = 0; i < 7; i++) {
    const t0 = performance.now();
    pr = runPipeline({ history: eight, horizon: 40 });
    pts.push(performance.now() - t0);
  }
  console.log(`\nautomatic pipeline on 8 weeks (1,344 h) of real demand, 40-hour forecast: median ${fmt(median(pts), 0)} ms (first, cold run ${fmt(firstMs, 0)} ms); chose ${pr.model ? describeModel(pr.model) : 'no model'}, method ${pr.method}`);

  // 3. accuracy
  const days = 28;
  const t0 = performance.now();
  const bt = backtest(taylor, { days, method: 'auto', windowHours: 8 * 168 });
  const btMs = performance.now() - t0;
  const naive = backtest(taylor, { days, method: 'seasonal-naive', windowHours: 8 * 168 });
  let rMape = NaN;
  let rOk = 0;
  if (rVersion) {
    const origins = bt.days.filter((d) => d.choice).map((d) => ({ from: Math.max(0, d.origin - 8 * 168), origin: d.origin, h: d.hours, diff: [d.choice!.diff], p: d.choice!.p, q: d.choice!.q, P: d.choice!.P ?? 0, Q: d.choice!.Q ?? 0, dayStart: d.dayStart }));
    const out = runR({ load: taylor, origins: origins.map(({ dayStart: _d, ...o }) => o) });
    const mapes: number[] = [];
    const ours: number[] = [];
    (out.forecasts as Array<{ ok: boolean; forecast?: number[] }>).forEach((f, i) => {
      if (!f.ok || !f.forecast) return;
      rOk++;
      const ds = origins[i].dayStart;
      mapes.push(accuracy(taylor.slice(ds, ds + origins[i].h), { mean: f.forecast }).mape);
      const day = bt.days.find((d) => d.dayStart === ds)!;
      ours.push(day.accuracy.mape);
    });
    rMape = mapes.reduce((a, b) => a + b, 0) / mapes.length;
  }
  console.log(`\nday-ahead accuracy, real demand (R forecast::taylor, hourly), last ${bt.days.length} days, 8-week window, issued at midnight:`);
  console.log('method                                        MAPE %   MAE MW   RMSE MW  bias MW  cov80   cov95');
  const line = (name: string, s: { mape: number; mae: number; rmse: number; bias: number; coverage80: number; coverage95: number }) =>
    console.log(`${name.padEnd(45)} ${fmt(s.mape).padStart(6)} ${fmt(s.mae, 0).padStart(8)} ${fmt(s.rmse, 0).padStart(9)} ${fmt(s.bias, 0).padStart(8)} ${fmt(100 * s.coverage80, 1).padStart(6)} ${fmt(100 * s.coverage95, 1).padStart(6)}`);
  line('automatic pipeline', bt);
  line('weekly seasonal naive', naive);
  if (rVersion) console.log(`${'R arima, same differencing and orders'.padEnd(45)} ${fmt(rMape).padStart(6)}   (${rOk} origins)`);
  console.log(`improvement over seasonal naive: ${fmt(100 * (1 - bt.mape / naive.mape), 1)} % of its MAPE; backtest ${fmt(btMs / 1000, 1)} s in all`);
  const fallbacks = bt.days.filter((d) => d.fallbackReason).length;
  if (fallbacks) console.log(`(${fallbacks} of ${bt.days.length} origins fell back to seasonal naive)`);
  printWindowTable(bt, naive);
}

/**
 * The rolling day-ahead backtest over the last 7, 14 and 28 days beside R's forecast::auto.arima
 * with weekly seasonal differencing on the same origins (fixtures/r-auto-arima-backtest.json,
 * regenerated by the R script beside it: R's automatic search takes minutes, so the bench reads
 * its committed result).
 */
function printWindowTable(bt: BacktestResult, naive: BacktestResult): void {
  const path = join(FIX, 'r-auto-arima-backtest.json');
  const r = existsSync(path) ? (JSON.parse(readFileSync(path, 'utf8')) as { r: string; forecast: string; windows: Array<{ days: number; mape: number; coverage80: number; coverage95: number }> }) : null;
  console.log(`\nrolling day-ahead windows (the same backtest's last N days) beside R ${r ? `${r.r}, forecast ${r.forecast}` : '(fixture missing)'} auto.arima on the (1−B^168)-differenced series:`);
  console.log('days   ours MAPE %  R MAPE %  naive MAPE %   ours cov80  cov95   R cov80  cov95');
  for (const n of [7, 14, 28]) {
    const days = bt.days.slice(-n);
    const base = naive.days.slice(-n);
    const mean = (v: number[]) => v.reduce((a, b) => a + b, 0) / v.length;
    const hours = days.reduce((a, d) => a + d.accuracy.n, 0);
    const cov = (k: 'coverage80' | 'coverage95') => days.reduce((a, d) => a + d.accuracy[k] * d.accuracy.n, 0) / hours;
    const rw = r?.windows.find((w) => w.days === n);
    console.log(
      `${String(n).padStart(4)}   ${fmt(mean(days.map((d) => d.accuracy.mape))).padStart(11)} ${rw ? fmt(rw.mape).padStart(9) : '      n/a'} ${fmt(mean(base.map((d) => d.accuracy.mape))).padStart(13)}   ${fmt(100 * cov('coverage80'), 1).padStart(10)} ${fmt(100 * cov('coverage95'), 1).padStart(6)}   ${rw ? fmt(100 * rw.coverage80, 1).padStart(7) : '    n/a'} ${rw ? fmt(100 * rw.coverage95, 1).padStart(6) : ''}`,
    );
  }
}

main();
