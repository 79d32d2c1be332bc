/**
 * The datasets table of `npm run bench`: which cases it takes, and that its summary says where
 * the engine stands against R. R's figures here are given, not run (the bench runs R).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { DatasetCase, datasetCases, DatasetRow, printDatasetTable, timeDatasets } from './bench-datasets';

const fixture = JSON.parse(readFileSync(join(__dirname, '../fixtures/r-arima-real.json'), 'utf8'));

describe('bench: the other real series', () => {
  const cases = datasetCases(fixture as unknown as { cases: DatasetCase[] });

  it("takes R's datasets and leaves the demand series to the first table", () => {
    expect(cases.some((c) => c.name.startsWith('taylor'))).toBe(false);
    expect(cases.map((c) => c.name)).toEqual(expect.arrayContaining(['sunspot.month ARMA(2,1) with mean', 'co2 airline (0,1,1)(0,1,1)12']));
  });

  it("times the engine and reaches R's recorded log-likelihood on a case", () => {
    const lynx = cases.filter((c) => c.name === 'log10(lynx) ARMA(2,1) with mean');
    const [row] = timeDatasets(lynx);
    expect(row.engineMs).toBeGreaterThan(0);
    const rec = (fixture as unknown as { cases: Array<{ name: string; cssMl: { loglik: number } }> }).cases.find((c) => c.name === lynx[0].name)!;
    expect(row.loglik).toBeGreaterThan(rec.cssMl.loglik - 1e-4);
  });

  it('prints the ratio to the faster R method that reached its best, and says where R stopped lower', () => {
    const rows: DatasetRow[] = [
      { name: 'a', n: 100, engineMs: 2, loglik: -10, r: { cssMl: { ok: true, ms: 40, loglik: -10, code: 0 }, ml: { ok: true, ms: 20, loglik: -10.5, code: 0 } } },
      { name: 'b', n: 100, engineMs: 1, loglik: -5, r: { cssMl: { ok: true, ms: 3, loglik: -8, code: 0 }, ml: { ok: false, ms: 1, error: 'x' } } },
    ];
    const out: string[] = [];
    printDatasetTable(rows, (s) => out.push(s));
    // a: ML stopped lower, so CSS-ML's 40 ms counts: 20x; b: 3x, with R 3.0 below
    expect(out.find((l) => l.startsWith('a '))).toMatch(/\s20\.0\s/);
    expect(out.find((l) => l.startsWith('b '))).toMatch(/R ML failed; R stopped 3\.0 below/);
    expect(out[out.length - 1]).toMatch(/2 cases; engine log-likelihood below R's best \(by more than 0\.001\) in 0; R\/engine time: min 3\.0x, median 11\.5x, 1 of 2 at 8x or more/);
  });
});
