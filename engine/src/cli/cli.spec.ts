/**
 * The fit and backtest commands on the real demand fixture (src/fixtures/taylor-hourly.csv:
 * R package forecast, dataset taylor, hourly means) and on a small file with a fault.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runFit } from './fit';
import { runBacktest } from './backtest';

const taylor = join(__dirname, '../fixtures/taylor-hourly.csv');

describe('command line', () => {
  it('fit --json has the documented keys', () => {
    const r = runFit(['--input', taylor, '--diff', '168', '--order', '2,1', '--json']).json;
    for (const k of ['coefficients', 'sigma2', 'loglik', 'aic', 'aicc', 'bic', 'ljungBox', 'n', 'fitMs', 'startedFrom']) expect(r).toHaveProperty(k);
    expect((r.coefficients as Array<{ name: string; se: number }>).map((c) => c.name)).toEqual(['ar1', 'ar2', 'ma1']);
    expect(r.n).toBe(2016 - 168);
    expect(r.aicc as number).toBeGreaterThan(r.aic as number);
  });
  it('fit without differencing includes a mean by default, and --no-mean removes it', () => {
    const a = runFit(['--input', taylor, '--diff', 'none', '--order', '1,0', '--json']).json;
    expect((a.coefficients as Array<{ name: string }>).map((c) => c.name)).toEqual(['ar1', 'intercept']);
    const b = runFit(['--input', taylor, '--diff', 'none', '--order', '1,0', '--no-mean', '--json']).json;
    expect((b.coefficients as Array<{ name: string }>).map((c) => c.name)).toEqual(['ar1']);
  });
  it('fit --repeat N refits N times in one process, warmed up, and reports the first and the median of the rest', () => {
    const one = runFit(['--input', taylor, '--diff', '24,168', '--order', '2,1', '--json']).json;
    const r = runFit(['--input', taylor, '--diff', '24,168', '--order', '2,1', '--repeat', '3', '--json']).json;
    expect(r.fits).toBe(3);
    expect(one.fits).toBe(1);
    expect(one.fitMs).toBe(one.firstFitMs);
    expect(one.warmUpFits).toBe(0);
    // the timed fits come after the benchmarks' warm-up: at least 20 untimed fits unless a
    // second passed first (warm-timing.ts), never none
    expect(r.warmUpFits as number).toBeGreaterThan(0);
    for (const k of ['fitMs', 'firstFitMs']) expect(r[k] as number).toBeGreaterThan(0);
    // the same model every time
    expect(r.loglik).toBe(one.loglik);
    expect(runFit(['--input', taylor, '--diff', '24,168', '--order', '2,1', '--repeat', '3']).text).toMatch(/median of 2 warm fits after \d+ untimed warm-up fits; first /);
  });
  it.each(['0', '-2', '2.5', 'x', '10000'])('fit --repeat=%s is refused', (v) => {
    expect(() => runFit(['--input', taylor, '--diff', '24', '--order', '1,0', `--repeat=${v}`])).toThrow(`--repeat expects a whole number from 1 to 9999, got "${v}"`);
  });
  it('backtest --json has mape, baseline.mape, coverage of the 80 % and 95 % bands and a row per day', () => {
    const r = runBacktest(['--input', taylor, '--days', '3', '--method', 'fixed', '--diff', '24,168', '--order', '1,1', '--json']).json;
    expect(typeof r.mape).toBe('number');
    expect(typeof (r.baseline as { mape: number }).mape).toBe('number');
    const cov = r.coverage as { p80: number; p95: number };
    const days = r.days as Array<{ date: string; hours: number; model: string; coverage80: number; coverage95: number }>;
    // the summary is the share over all 72 hours, so the mean of three 24-hour days
    expect(cov.p80).toBeCloseTo(days.reduce((s, d) => s + d.coverage80, 0) / 3, 12);
    expect(cov.p95).toBeCloseTo(days.reduce((s, d) => s + d.coverage95, 0) / 3, 12);
    expect(cov.p80).toBeLessThanOrEqual(cov.p95);
    expect(days.map((d) => d.date)).toEqual(['2000-08-25', '2000-08-26', '2000-08-27']);
    expect(days.every((d) => d.hours === 24 && d.model.includes('ARMA(1,1)'))).toBe(true);
  });
  it('backtest with an issue hour forecasts from the day before', () => {
    const r = runBacktest(['--input', taylor, '--days', '2', '--issue-hour', '9', '--method', 'seasonal-naive', '--json']).json;
    const days = r.days as Array<{ issuedAtIndex: number }>;
    expect(days[1].issuedAtIndex).toBe(2016 - 48 + 9);
  });
  it('--help prints the usage of each command and reads no file', () => {
    expect(runFit(['--help']).text).toMatch(/^usage: npm run fit -- --input FILE\.csv /);
    expect(runBacktest(['-h']).text).toMatch(/^usage: npm run backtest -- --input FILE\.csv /);
  });
  it('a bad file names the line and the fault', () => {
    const dir = mkdtempSync(join(tmpdir(), 'mw-'));
    const f = join(dir, 'bad.csv');
    writeFileSync(f, 'timestamp,load_mw\n2024-01-01T00:00:00Z,1\n2024-01-01T01:00:00Z,x\n');
    expect(() => runFit(['--input', f, '--diff', 'none', '--order', '0,0'])).toThrow('line 3: load "x" is not a number');
  });
});
