/**
 * `npm run bench -- --windows-only`: fidelity where the data move. Every order of the real-series
 * table (p, q ≤ 3, without and with the seasonal block (1, 1) at 24, each differencing the
 * pipeline considers) fitted on eight-week windows of the open demand series (weeks 1–8, 3–10
 * and 5–12: the pipeline's training length), by the engine and by R 4.2.2 stats::arima ("CSS-ML"
 * and "ML") in the same run, and the fits where the engine's log-likelihood ends below R's best.
 * The exact likelihood of differenced load can have several maxima near a unit root, and which
 * one a search reaches depends on the data: a change to the starts or the search is checked here
 * on 384 fits instead of the 128 of one series. No timing (one fit a side).
 */
import { difference, fitArma } from '@morrowline/engine';
import { RealCase, realCases } from './bench-real';

/** Eight-week windows (first hour, hours) of the hourly demand series. */
export const WINDOWS: Array<{ name: string; from: number; hours: number }> = [
  { name: 'weeks 1-8', from: 0, hours: 1344 },
  { name: 'weeks 3-10', from: 336, hours: 1344 },
  { name: 'weeks 5-12', from: 672, hours: 1344 },
];

export interface WindowCase extends RealCase {
  window: string;
  from: number;
  hours: number;
}

export function windowCases(): WindowCase[] {
  const out: WindowCase[] = [];
  for (const w of WINDOWS) for (const c of realCases()) out.push({ ...c, id: `${w.name}:${c.id}`, window: w.name, from: w.from, hours: w.hours });
  return out;
}

export interface WindowRow {
  c: WindowCase;
  loglik: number;
  startedFrom: string;
  /** R's "CSS-ML" and "ML" log-likelihoods (NaN where R failed or was not run) */
  rCssMl: number;
  rMl: number;
}

export function fitWindows(load: number[], cases: WindowCase[]): WindowRow[] {
  return cases.map((c) => {
    const w = difference(load.slice(c.from, c.from + c.hours), c.diff);
    const f = fitArma(w, { p: c.p, q: c.q, P: c.P, Q: c.Q, period: c.P + c.Q > 0 ? 24 : 0, includeMean: false }, { computeSe: false });
    return { c, loglik: f.loglik, startedFrom: f.startedFrom, rCssMl: NaN, rMl: NaN };
  });
}

const TOL = 0.01;

/** The rows below R's best by more than 0.01, then the counts. */
export function printWindows(rows: WindowRow[], log: (s: string) => void = console.log): void {
  log('eight-week windows of the real demand series, every order of the real-series table, engine (exact ML) against the');
  log('higher of R stats::arima "CSS-ML" and "ML" in the same run; rows where the engine ends below R by more than 0.01:');
  let below = 0;
  let above = 0;
  let compared = 0;
  for (const r of rows) {
    const best = Math.max(...[r.rCssMl, r.rMl].filter(Number.isFinite));
    if (!Number.isFinite(best)) continue;
    compared++;
    const d = r.loglik - best;
    if (d > TOL) above++;
    if (d < -TOL) {
      below++;
      const order = `ARMA(${r.c.p},${r.c.q})${r.c.P + r.c.Q > 0 ? `(${r.c.P},${r.c.Q})24` : ''}`;
      log(`  ${r.c.window.padEnd(11)} ${r.c.diff.join('x').padEnd(7)} ${order.padEnd(17)} engine ${r.loglik.toFixed(3)}  R ${best.toFixed(3)}  (${d.toFixed(3)}, from ${r.startedFrom})`);
    }
  }
  log(`summary: ${compared} fits compared; engine below R's best (by more than ${TOL}) in ${below}, above it in ${above}`);
}
