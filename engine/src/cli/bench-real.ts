/**
 * The real-series table of `npm run bench`: the open England & Wales demand series (R forecast's
 * `taylor`, hourly means, 2,016 hours) under each differencing the automatic pipeline considers,
 * every ARMA order p, q ≤ 3 without and with a seasonal block (1, 1) at 24, fitted by the compiled
 * engine warm in this process (exact ML with standard errors, as R's arima computes them too) and
 * by R 4.2.2 stats::arima ("CSS-ML", R's default, and "ML") in the same run, log-likelihoods side
 * by side. The likelihood is the same function on both sides: R gets the differenced series and
 * no mean, as the engine does.
 */
import { DEFAULT_CANDIDATES, difference, fitArma, median } from '@morrowline/engine';
import { timeWarm } from './warm-timing';

export interface RealCase {
  id: string;
  diff: number[];
  p: number;
  q: number;
  /** seasonal block (P, Q) at period 24, or (0, 0) */
  P: number;
  Q: number;
}

export interface RFitTiming {
  ok: boolean;
  ms: number;
  loglik?: number;
  /** optim's convergence code: 0 converged, 1 iteration limit */
  code?: number;
  error?: string;
}

export interface RealRow extends RealCase {
  n: number;
  engineMs: number;
  firstMs: number;
  fits: number;
  loglik: number;
  startedFrom: string;
  r?: { cssMl: RFitTiming; ml: RFitTiming };
}

export const REAL_MAX_ORDER = 3;

/**
 * The hours taken out of the demand series for `npm run bench -- --gaps-only` (indices into its
 * 2,016 hours): four single hours and a run of three, as a meter's dropped readings and a short
 * outage leave them. Each differencing carries a missing hour into every difference that uses it.
 */
export const BENCH_MISSING_HOURS = [300, 700, 1100, 1101, 1102, 1500, 1900];

/** The series with the bench's missing hours set to NaN (a copy). */
export function withMissingHours(load: number[], hours: number[] = BENCH_MISSING_HOURS): number[] {
  const out = load.slice();
  for (const h of hours) if (h < out.length) out[h] = NaN;
  return out;
}

export function realCases(candidates: number[][] = DEFAULT_CANDIDATES): RealCase[] {
  const out: RealCase[] = [];
  for (const diff of candidates) {
    for (const seasonal of [false, true]) {
      for (let p = 0; p <= REAL_MAX_ORDER; p++) {
        for (let q = 0; q <= REAL_MAX_ORDER; q++) {
          const P = seasonal ? 1 : 0;
          const Q = seasonal ? 1 : 0;
          out.push({ id: `${diff.join('x')}-${p}-${q}-${P}${Q}`, diff, p, q, P, Q });
        }
      }
    }
  }
  return out;
}

/**
 * Times the engine on each case warm (warm-timing.ts): the first fit apart, then the median of
 * the fits after a warm-up, over a budget of about a second per case (3 to 25 fits).
 */
export function timeEngine(load: number[], cases: RealCase[]): RealRow[] {
  return cases.map((c) => {
    const w = difference(load, c.diff);
    const spec = { p: c.p, q: c.q, P: c.P, Q: c.Q, period: c.P + c.Q > 0 ? 24 : 0, includeMean: false };
    let f = fitArma(w, spec);
    const t = timeWarm(() => {
      f = fitArma(w, spec);
    });
    return { ...c, n: w.length, engineMs: t.warmMs, firstMs: t.firstMs, fits: t.timed, loglik: f.loglik, startedFrom: f.startedFrom };
  });
}

/**
 * The table's rows, the engine and R timed group by group (16 orders of one differencing, without
 * or with the seasonal block): the engine's fits of a group, then R's of the same group, so that
 * both sides of a ratio are measured within minutes of each other on a machine whose load moves
 * (all engine fits first and all of R's after had the two halves of a ratio under different
 * loads). `fitR` runs R on a group and returns its timings by case id (null: no R).
 */
export function timeRealTable(
  load: number[],
  cases: RealCase[],
  fitR: ((group: RealCase[]) => Map<string, { cssMl: RFitTiming; ml: RFitTiming }>) | null,
): RealRow[] {
  const rows: RealRow[] = [];
  for (let from = 0; from < cases.length; from += (REAL_MAX_ORDER + 1) ** 2) {
    const group = cases.slice(from, from + (REAL_MAX_ORDER + 1) ** 2);
    const timed = timeEngine(load, group);
    const byId = fitR ? fitR(group) : null;
    for (const row of timed) {
      const r = byId?.get(row.id);
      if (r) row.r = { cssMl: r.cssMl, ml: r.ml };
      rows.push(row);
    }
  }
  return rows;
}

/** The higher of R's two log-likelihoods (NaN when both failed). */
export function bestOfR(r: { cssMl: RFitTiming; ml: RFitTiming }): number {
  const v = [r.cssMl, r.ml].filter((x) => x.ok && Number.isFinite(x.loglik)).map((x) => x.loglik as number);
  return v.length ? Math.max(...v) : NaN;
}

const fmt = (v: number, d = 1) => (Number.isFinite(v) ? v.toFixed(d) : 'n/a');
/** R's times: a decimal below 10 ms, where they come from a timed loop */
const fmtMs = (v: number) => fmt(v, v < 10 ? 1 : 0);

function rNote(r: { cssMl: RFitTiming; ml: RFitTiming }): string {
  const notes: string[] = [];
  for (const [name, x] of [['CSS-ML', r.cssMl], ['ML', r.ml]] as const) {
    if (!x.ok) notes.push(`R ${name} failed: ${(x.error ?? '').slice(0, 40)}`);
    else if (x.code !== 0) notes.push(`R ${name} did not converge (code ${x.code})`);
  }
  return notes.join('; ');
}

/** The demand series the table is drawn from by default. */
export const TAYLOR_SOURCE = 'England & Wales, R forecast::taylor, hourly means, 2,016 h';

export function printRealTable(rows: RealRow[], log: (s: string) => void = console.log, missing: number[] = [], source = TAYLOR_SOURCE): void {
  log(`real demand (${source}${missing.length ? `; hours ${missing.join(', ')} taken out, missing on both sides` : ''}), each differencing the pipeline considers,`);
  log('ARMA(p,q) p, q <= 3 without and with a seasonal block (1,1) at 24; exact ML with standard errors, compiled engine warm in one');
  log('process (median of 3-100 fits over about a second, after a first one and a warm-up of at least 100 ms and 20 fits, cut at 1 s) against R stats::arima on the same differenced series,');
  log('no mean, in the same run, each group of 16 orders timed on both sides in turn; R fits under 100 ms timed as the mean of a loop of at least 200 ms');
  log('differencing  order              n   engine ms  first ms  R CSS-ML ms  R ML ms  R/engine  loglik engine  R CSS-ML       R ML      engine-R  note');
  for (const r of rows) {
    const order = `ARMA(${r.p},${r.q})${r.P + r.Q > 0 ? `(${r.P},${r.Q})24` : ''}`;
    const best = r.r ? bestOfR(r.r) : NaN;
    // the faster of R's two methods that reached R's best likelihood (to 0.01)
    const rMs = r.r ? Math.min(...[r.r.cssMl, r.r.ml].filter((x) => x.ok && (x.loglik as number) >= best - 0.01).map((x) => x.ms)) : NaN;
    const ratio = rMs >= 1 ? rMs / r.engineMs : NaN;
    log(
      `${r.diff.join('x').padEnd(12)}  ${order.padEnd(17)} ${String(r.n).padStart(5)} ${fmt(r.engineMs, 2).padStart(10)} ${fmt(r.firstMs, 1).padStart(9)} ${r.r ? fmtMs(r.r.cssMl.ms).padStart(12) : '         n/a'} ${r.r ? fmtMs(r.r.ml.ms).padStart(8) : '     n/a'} ${fmt(ratio, 1).padStart(9)} ${fmt(r.loglik, 3).padStart(14)} ${r.r?.cssMl.ok ? fmt(r.r.cssMl.loglik as number, 3).padStart(12) : '         n/a'} ${r.r?.ml.ok ? fmt(r.r.ml.loglik as number, 3).padStart(12) : '         n/a'} ${fmt(r.loglik - best, 3).padStart(9)}  ${r.r ? rNote(r.r) : ''}`,
    );
  }
  const withR = rows.filter((r) => r.r && Number.isFinite(bestOfR(r.r)));
  if (withR.length) {
    const below = withR.filter((r) => r.loglik < bestOfR(r.r!) - 1e-3);
    // R times below its timer's resolution (1 ms: the orders without coefficients) give no ratio
    const ratios = withR
      .map((r) => Math.min(...[r.r!.cssMl, r.r!.ml].filter((x) => x.ok && (x.loglik as number) >= bestOfR(r.r!) - 0.01).map((x) => x.ms)))
      .map((ms, i) => (ms >= 1 ? ms / withR[i].engineMs : NaN))
      .filter(Number.isFinite);
    log(
      `summary: ${withR.length} cases; engine log-likelihood below R's best (by more than 0.001) in ${below.length}${below.length ? ` (${below.map((r) => r.id).join(', ')})` : ''}; ` +
        `R/engine time (R's faster method reaching its best): min ${fmt(Math.min(...ratios))}x, median ${fmt(median(ratios))}x, ${ratios.filter((x) => x >= 8).length} of ${ratios.length} at 8x or more`,
    );
  }
}
