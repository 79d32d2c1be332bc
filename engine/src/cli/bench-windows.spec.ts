/**
 * The windows check of `npm run bench`: which fits it makes, and that it reports the fits where
 * the engine ends below R. R's figures here are given, not run (the bench runs R).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fitWindows, printWindows, WindowRow, windowCases, WINDOWS } from './bench-windows';

const load = JSON.parse(readFileSync(join(__dirname, '../fixtures/taylor-hourly.json'), 'utf8')).load as number[];

describe('bench: eight-week windows of the demand series', () => {
  it('fits every order of the real-series table on each window, all inside the series', () => {
    const cases = windowCases();
    // four differencings (DEFAULT_CANDIDATES) × 16 orders × without and with the block, on three windows
    expect(cases).toHaveLength(3 * 128);
    expect(new Set(cases.map((c) => c.id)).size).toBe(cases.length);
    for (const w of WINDOWS) expect(w.from + w.hours).toBeLessThanOrEqual(load.length);
  });

  it('reaches R 4.2.2\'s maximum on a case that once stopped below it', () => {
    // weeks 5-12 daily-differenced MA(2): R's "CSS-ML" and "ML" both reach −10956.804
    // (fixtures/r-arima-real.R, "taylor hourly weeks 5-12 (1-B^24) MA(2)")
    const c = windowCases().find((k) => k.window === 'weeks 5-12' && k.diff.join() === '24' && k.p === 0 && k.q === 2 && k.P === 0)!;
    const [row] = fitWindows(load, [c]);
    expect(row.loglik).toBeGreaterThan(-10956.804 - 0.01);
  });

  it('lists the fits below R and counts them', () => {
    const c = windowCases().slice(0, 3);
    const rows: WindowRow[] = [
      { c: c[0], loglik: -100, startedFrom: 'zero', rCssMl: -100.5, rMl: -99 },
      { c: c[1], loglik: -100, startedFrom: 'css', rCssMl: -101, rMl: NaN },
      { c: c[2], loglik: -100, startedFrom: 'css', rCssMl: NaN, rMl: NaN },
    ];
    const out: string[] = [];
    printWindows(rows, (s) => out.push(s));
    expect(out.filter((l) => l.includes('engine -100.000'))).toHaveLength(1);
    expect(out.find((l) => l.includes('engine -100.000'))).toMatch(/R -99\.000 {2}\(-1\.000, from zero\)/);
    expect(out[out.length - 1]).toBe("summary: 2 fits compared; engine below R's best (by more than 0.01) in 1, above it in 1");
  });
});
