/**
 * ARMA order selection by an information criterion over a grid p ≤ maxP, q ≤ maxQ:
 * AICc (Hurvich & Tsai 1989) or BIC (Schwarz 1978), each model fitted by exact ML (./arma/fit).
 * Candidates are fitted without standard errors; only the winner gets its Hessian.
 */
import { ArmaFit, fitArma, needsSecondStart } from './arma/fit';
import { hannanRissanen } from './arma/hannan-rissanen';

export type Criterion = 'aicc' | 'bic' | 'aic';

export interface SelectOptions {
  maxP?: number;
  maxQ?: number;
  criterion?: Criterion;
  includeMean?: boolean;
  /** optional seasonal block carried by every candidate */
  P?: number;
  Q?: number;
  period?: number;
  computeSe?: boolean;
  /**
   * Fit by exact ML only the best `screen` orders by the criterion computed from the
   * Hannan–Rissanen regression (the order selection Hannan & Rissanen 1982 proposed); 0 = fit
   * every order. Default 0.
   */
  screen?: number;
  maxIter?: number;
  /** relative-decrease stopping rule of the candidates' BFGS (see FitOptions.fTol) */
  fTol?: number;
  /**
   * Search candidates with p, q ≥ 2 from a second start too (FitOptions.secondStart). Off by
   * default: selection screens many candidates, with capped iterations already, and the nightly
   * refit of every zone has a time budget; the second start doubles or triples those candidates.
   * The same switch governs the candidates' restarts from a boundary (FitOptions.boundaryRestarts);
   * the winner's final fit (computeSe) makes both.
   */
  secondStart?: boolean;
}

export interface CandidateScore {
  p: number;
  q: number;
  loglik: number;
  aic: number;
  aicc: number;
  bic: number;
  ok: boolean;
  error?: string;
}

export interface Selection {
  best: ArmaFit;
  candidates: CandidateScore[];
  /** every candidate fitted without error, in the order fitted (the winner's first fit, not its final one) */
  fits: ArmaFit[];
  criterion: Criterion;
}

export function selectOrder(x: ArrayLike<number>, opts: SelectOptions = {}): Selection {
  const maxP = opts.maxP ?? 3;
  const maxQ = opts.maxQ ?? 3;
  if (maxP > 5 || maxQ > 5) throw new Error('orders above 5 are not supported');
  const criterion = opts.criterion ?? 'aicc';
  const candidates: CandidateScore[] = [];
  const fits: ArmaFit[] = [];
  let best: ArmaFit | null = null;
  let orders: Array<[number, number]> = [];
  for (let p = 0; p <= maxP; p++) for (let q = 0; q <= maxQ; q++) orders.push([p, q]);
  const screen = opts.screen ?? 0;
  if (screen > 0 && screen < orders.length) {
    const P = opts.P ?? 0;
    const Q = opts.Q ?? 0;
    const scored = orders.map(([p, q]) => {
      let n: number;
      let s2: number;
      if (p + q + P + Q === 0) {
        // white noise: the "regression" has no regressors, σ² is the mean square
        let ss = 0;
        n = 0;
        for (let i = 0; i < x.length; i++) {
          if (Number.isFinite(x[i])) {
            ss += x[i] * x[i];
            n++;
          }
        }
        s2 = ss / n;
      } else {
        const hr = hannanRissanen(x, { p, q, P, Q, period: opts.period ?? 1 });
        n = hr.rows;
        s2 = hr.sigma2;
      }
      const k = p + q + P + Q + 1;
      const base = n * Math.log(s2);
      const pen = criterion === 'bic' ? k * Math.log(n) : 2 * k + (criterion === 'aicc' ? (2 * k * (k + 1)) / Math.max(n - k - 1, 1) : 0);
      return { p, q, score: Number.isFinite(base) ? base + pen : Infinity };
    });
    scored.sort((a, b) => a.score - b.score);
    orders = scored.slice(0, screen).map((s) => [s.p, s.q]);
  }
  for (const [p, q] of orders) {
    {
      try {
        const f = fitArma(x, { p, q, P: opts.P, Q: opts.Q, period: opts.period, includeMean: opts.includeMean ?? false }, { computeSe: false, maxIter: opts.maxIter, fTol: opts.fTol, secondStart: opts.secondStart ?? false, boundaryRestarts: opts.secondStart ?? false });
        const ok = Number.isFinite(f.loglik);
        candidates.push({ p, q, loglik: f.loglik, aic: f.aic, aicc: f.aicc, bic: f.bic, ok });
        if (ok) fits.push(f);
        if (ok && (!best || f[criterion] < best[criterion])) best = f;
      } catch (e) {
        candidates.push({ p, q, loglik: NaN, aic: NaN, aicc: NaN, bic: NaN, ok: false, error: (e as Error).message });
      }
    }
  }
  if (!best) throw new Error('no ARMA candidate could be fitted');
  if (opts.computeSe ?? true) {
    const chosen = best;
    best = fitArma(x, chosen.spec, { start: { ar: chosen.ar, ma: chosen.ma, sar: chosen.sar, sma: chosen.sma } });
    // the chosen order gets the thorough search of a final fit: a second one from zero
    if (needsSecondStart(chosen.spec)) {
      const zero = (m: number) => new Array<number>(m).fill(0);
      const other = fitArma(x, chosen.spec, { start: { ar: zero(chosen.spec.p), ma: zero(chosen.spec.q), sar: zero(chosen.spec.P), sma: zero(chosen.spec.Q) } });
      if (other.loglik > best.loglik) best = { ...other, startedFrom: 'zero' };
    }
  }
  return { best, candidates, fits, criterion };
}
