/**
 * The second real-series table of `npm run bench`: real series other than the demand one, R's
 * own datasets chosen for what makes real data hard (fixtures/r-arima-real.R: long quasi-periodic
 * cycles in sunspot.month, sunspots, sunspot.year and lynx; means far from zero and near-unit
 * roots in BJsales, Nile and LakeHuron; treering's 7,980 values; seasonal differencing in co2,
 * nottem and UKDriverDeaths), each fitted as R's arima is called on it (differencing, seasonal
 * part and mean included), the compiled engine warm in this process against R 4.2.2
 * stats::arima ("CSS-ML" and "ML") in the same run, log-likelihoods side by side. The demand
 * series' own cases of that fixture are left out: the first table has them.
 */
import { fitArima, median } from '@morrowline/engine';
import { timeWarm } from './warm-timing';
import { bestOfR, RFitTiming } from './bench-real';

export interface DatasetCase {
  name: string;
  x: Array<number | null>;
  /** R's order (p, d, q) */
  order: number[];
  seasonal: number[];
  period: number | null;
  includeMean: boolean;
}

export interface DatasetRow {
  name: string;
  n: number;
  engineMs: number;
  loglik: number;
  r?: { cssMl: RFitTiming; ml: RFitTiming };
}

/** The cases of r-arima-real.json that are not the demand series. */
export function datasetCases(fixture: { cases: DatasetCase[] }): DatasetCase[] {
  return fixture.cases.filter((c) => !c.name.startsWith('taylor'));
}

function differencesOf(c: DatasetCase): number[] {
  const d: number[] = [];
  for (let i = 0; i < c.order[1]; i++) d.push(1);
  for (let i = 0; i < c.seasonal[1]; i++) d.push(c.period as number);
  return d;
}

/** The engine's warm median (warm-timing.ts): 3 to 25 fits over about a second, after a warm-up. */
export function timeDatasets(cases: DatasetCase[]): DatasetRow[] {
  return cases.map((c) => {
    const x = c.x.map((v) => (v === null ? NaN : v));
    const spec = { diff: differencesOf(c), p: c.order[0], q: c.order[2], P: c.seasonal[0], Q: c.seasonal[2], period: c.period ?? 0, includeMean: c.includeMean };
    let f = fitArima(x, spec);
    const t = timeWarm(() => {
      f = fitArima(x, spec);
    });
    return { name: c.name, n: x.length, engineMs: t.warmMs, loglik: f.arma.loglik };
  });
}

const fmt = (v: number, d = 1) => (Number.isFinite(v) ? v.toFixed(d) : 'n/a');

export function printDatasetTable(rows: DatasetRow[], log: (s: string) => void = console.log): void {
  log("other real series (R's datasets, fixtures/r-arima-real.R), each as R's arima is called on it (differencing, seasonal part,");
  log('mean); exact ML with standard errors, compiled engine warm (median of 3-100 fits after a warm-up of at least 100 ms) against R stats::arima in the same run');
  log('series and model                                 n   engine ms  R CSS-ML ms  R ML ms  R/engine  loglik engine  R best        engine-R  note');
  const ratios: number[] = [];
  let below = 0;
  for (const r of rows) {
    const best = r.r ? bestOfR(r.r) : NaN;
    const reached = r.r ? [r.r.cssMl, r.r.ml].filter((x) => x.ok && (x.loglik as number) >= best - 0.01) : [];
    const rMs = reached.length ? Math.min(...reached.map((x) => x.ms)) : NaN;
    const ratio = rMs / r.engineMs;
    if (Number.isFinite(ratio)) ratios.push(ratio);
    if (r.loglik < best - 1e-3) below++;
    const notes = r.r
      ? [['CSS-ML', r.r.cssMl] as const, ['ML', r.r.ml] as const].filter(([, x]) => !x.ok || x.code !== 0).map(([m, x]) => (x.ok ? `R ${m} did not converge` : `R ${m} failed`))
      : [];
    // a maximum R stopped below is R's failure, not the engine's speed: said beside the ratio
    if (r.loglik > best + 0.05) notes.push(`R stopped ${fmt(r.loglik - best, 1)} below`);
    log(
      `${r.name.padEnd(46)} ${String(r.n).padStart(5)} ${fmt(r.engineMs, 2).padStart(10)} ${r.r ? fmt(r.r.cssMl.ms).padStart(12) : '         n/a'} ${r.r ? fmt(r.r.ml.ms).padStart(8) : '     n/a'} ${fmt(ratio).padStart(9)} ${fmt(r.loglik, 3).padStart(14)} ${fmt(best, 3).padStart(12)} ${fmt(r.loglik - best, 3).padStart(9)}  ${notes.join('; ')}`,
    );
  }
  if (ratios.length) {
    log(
      `summary: ${rows.length} cases; engine log-likelihood below R's best (by more than 0.001) in ${below}; R/engine time: min ${fmt(Math.min(...ratios))}x, median ${fmt(median(ratios))}x, ${ratios.filter((x) => x >= 8).length} of ${ratios.length} at 8x or more`,
    );
  }
}
