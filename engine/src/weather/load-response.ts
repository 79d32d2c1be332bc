/**
 * The load's response to the weather and calendar terms (./load-terms): β of
 *   y_t = x_t'β + u_t,   Δ(B) u_t an ARMA,
 * estimated by ordinary least squares on the weekly-differenced equation
 * (1 − B^168) y_t = (1 − B^168) x_t'β + (1 − B^168) u_t over the hours where everything is known.
 * The ARMA is then estimated on the load with the response taken out, u = y − Xβ (../weather-pipeline):
 * a two-step estimator of regression with ARIMA errors, consistent because OLS is under
 * autocorrelated stationary errors (Hamilton 1994, §8.2), chosen over the joint exact likelihood
 * for the many fits of a term choice and a backtest (one OLS is about a millisecond; the joint
 * fit is an ARMA fit per regressor set). The weekly difference removes the weekly load shape the
 * terms do not describe, so the response is estimated from how the load moved against how the
 * weather moved from one week to the next.
 *
 * A column whose weekly difference is zero on every usable hour (no cooling hour in winter, no
 * holiday in the history), or is a linear combination of earlier columns on the hours used (a
 * bridge day that is also the only day after a holiday), carries no information of its own: its
 * β is 0 and it is reported as not estimated (columns taken in order, each kept when the
 * Cholesky pivot of X′X it adds is above 1e-9 of its own sum of squares).
 *
 * The thresholds θ_h and θ_c are chosen by profile likelihood over a grid: for each pair the
 * Gaussian likelihood of the OLS fit with σ² concentrated out, −n/2·log(RSS/n), so the pair with
 * the smallest residual sum of squares wins (Hinkley 1969 on the likelihood of a broken line;
 * grids of degree-day thresholds are common practice).
 */
import { inverse, Matrix, solve } from 'ml-matrix';
import { CalendarHours, termColumns, termNames, TermSet } from './load-terms';

export const RESPONSE_LAG = 168;
export const HEAT_GRID = [8, 10, 12, 14, 16, 18];
export const COOL_GRID = [16, 18, 20, 22, 24, 26];

export interface LoadResponse {
  terms: TermSet;
  names: string[];
  /** one per name; 0 for a column not estimated */
  beta: Float64Array;
  /** OLS standard errors of β (NaN for a column not estimated) */
  se: Float64Array;
  /**
   * The OLS covariance s²(X'X)⁻¹ of the estimated columns only (`names` in the order of `names`
   * above, row-major `values`): what a band on a sum of coefficients (the response at a steady
   * temperature, summed over the blocks of the day) needs, since the block terms are correlated.
   */
  covariance: { names: string[]; values: Float64Array };
  estimated: boolean[];
  rss: number;
  /** rows in the least-squares fit */
  n: number;
}

const NO_COVARIANCE = (): LoadResponse['covariance'] => ({ names: [], values: new Float64Array(0) });

/** The response with no terms at all: the model without weather. */
export function noResponse(terms: TermSet): LoadResponse {
  return { terms, names: [], beta: new Float64Array(0), se: new Float64Array(0), covariance: NO_COVARIANCE(), estimated: [], rss: NaN, n: 0 };
}

export function hasTerms(t: TermSet): boolean {
  return t.temperature || t.recency || t.calendar;
}

/** β by OLS on the weekly-differenced equation over hours [0, n) of y. */
export function estimateResponse(y: ArrayLike<number>, temp: ArrayLike<number>, cal: CalendarHours, terms: TermSet): LoadResponse {
  const names = termNames(terms);
  const n = y.length;
  if (!names.length) return noResponse(terms);
  const cols = termColumns(terms, temp, cal, 0, n);
  const k = cols.length;
  const L = RESPONSE_LAG;
  // normal equations accumulated in typed arrays: the threshold grid runs some thirty of these
  const xtx = new Float64Array(k * k);
  const xty = new Float64Array(k);
  const row = new Float64Array(k);
  let yty = 0;
  let rows = 0;
  for (let t = L; t < n; t++) {
    const d = y[t] - y[t - L];
    if (!(d === d)) continue;
    let ok = true;
    for (let c = 0; c < k && ok; c++) {
      row[c] = cols[c][t] - cols[c][t - L];
      ok = row[c] === row[c];
    }
    if (!ok) continue;
    rows++;
    yty += d * d;
    for (let i = 0; i < k; i++) {
      const ri = row[i];
      if (ri === 0) continue;
      xty[i] += ri * d;
      for (let j = 0; j <= i; j++) xtx[i * k + j] += ri * row[j];
    }
  }
  const keep = independentColumns(xtx, k);
  const beta = new Float64Array(k);
  const se = new Float64Array(k).fill(NaN);
  const estimated = new Array<boolean>(k).fill(false);
  const m = keep.length;
  if (!m || rows <= m + 10) return { terms, names, beta, se, covariance: NO_COVARIANCE(), estimated, rss: NaN, n: rows };
  const A = new Matrix(m, m);
  const b = new Array<number>(m);
  keep.forEach((ci, i) => {
    b[i] = xty[ci];
    keep.forEach((cj, j) => A.set(i, j, ci >= cj ? xtx[ci * k + cj] : xtx[cj * k + ci]));
  });
  let sol: number[];
  let inv: Matrix;
  try {
    sol = solve(A, Matrix.columnVector(b)).getColumn(0);
    inv = inverse(A);
  } catch {
    return { terms, names, beta, se, covariance: NO_COVARIANCE(), estimated, rss: NaN, n: rows };
  }
  if (!sol.every(Number.isFinite)) return { terms, names, beta, se, covariance: NO_COVARIANCE(), estimated, rss: NaN, n: rows };
  // RSS = y'y − 2β'X'y + β'X'Xβ = y'y − β'X'y at the least-squares solution
  let rss = yty;
  for (let i = 0; i < m; i++) rss -= sol[i] * b[i];
  rss = Math.max(rss, 0);
  const s2 = rss / Math.max(rows - m, 1);
  keep.forEach((c, i) => {
    beta[c] = sol[i];
    se[c] = Math.sqrt(Math.max(inv.get(i, i) * s2, 0));
    estimated[c] = true;
  });
  const covariance = { names: keep.map((c) => names[c]), values: new Float64Array(m * m) };
  for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) covariance.values[i * m + j] = inv.get(i, j) * s2;
  return { terms, names, beta, se, covariance, estimated, rss, n: rows };
}

/** The thresholds of the grid with the smallest residual sum of squares (profile likelihood, see header). */
export function chooseThresholds(y: ArrayLike<number>, temp: ArrayLike<number>, cal: CalendarHours, terms: TermSet): LoadResponse {
  let best: LoadResponse | null = null;
  for (const heatBelow of HEAT_GRID)
    for (const coolAbove of COOL_GRID) {
      if (coolAbove < heatBelow) continue;
      const r = estimateResponse(y, temp, cal, { ...terms, heatBelow, coolAbove });
      // equal sample sizes across the grid (the rows used do not depend on the thresholds), so RSS compares the likelihoods
      if (Number.isFinite(r.rss) && (!best || r.rss < best.rss)) best = r;
    }
  return best ?? estimateResponse(y, temp, cal, terms);
}

/** x_t'β for hours [from, to) on the temperature path `temp` (NaN where a term is NaN). */
export function responseValues(r: LoadResponse, temp: ArrayLike<number>, cal: CalendarHours, from: number, to: number): Float64Array {
  const out = new Float64Array(Math.max(0, to - from));
  if (!r.names.length) return out;
  const cols = termColumns(r.terms, temp, cal, from, to);
  for (let c = 0; c < cols.length; c++) {
    const b = r.beta[c];
    if (b === 0) continue;
    const col = cols[c];
    for (let i = 0; i < out.length; i++) out[i] += b * col[i];
  }
  return out;
}

/** Indices of the columns, in order, that are not linear combinations of those kept before them (pivoted Cholesky of X′X). */
export function independentColumns(xtx: Float64Array, k: number): number[] {
  const keep: number[] = [];
  const L: number[][] = []; // rows of the Cholesky factor of the kept block
  for (let c = 0; c < k; c++) {
    const diag = xtx[c * k + c];
    if (!(diag > 0)) continue;
    const z: number[] = [];
    let zz = 0;
    for (let i = 0; i < keep.length; i++) {
      const ci = keep[i];
      let v = c >= ci ? xtx[c * k + ci] : xtx[ci * k + c];
      for (let j = 0; j < i; j++) v -= L[i][j] * z[j];
      const zi = v / L[i][i];
      z.push(zi);
      zz += zi * zi;
    }
    const d = diag - zz;
    if (d > 1e-9 * diag) {
      keep.push(c);
      L.push([...z, Math.sqrt(d)]);
    }
  }
  return keep;
}
