/**
 * Starting values by conditional sum of squares (CSS; Box & Jenkins 1970, §7.1): the innovations
 * are run forward from zero pre-sample innovations, conditioning on the first p + P·s values,
 *   e_t = w_t − Σ a_k w_{t−k} − Σ b_k e_{t−k},
 * and Σ e_t² is minimised over the same unconstrained (partial-autocorrelation) values the exact
 * likelihood is searched over, from all-zero coefficients. On long cycles and near-unit roots the
 * CSS optimum sits near the exact one and away from the boundary where a unit AR root and an MA
 * root near −1 cancel, which is why it serves as another start when a search ends there. A term
 * whose values are missing contributes nothing, and its innovation is taken as zero.
 */
import { minimizeBfgs } from './bfgs';
import { expandAr, expandMa } from './polynomials';
import { toInvertible, toStationary, toStationaryInto } from './transform';

export interface CssOrders {
  p: number;
  q: number;
  P: number;
  Q: number;
  period: number;
}

/** Σ e_t² / (number of terms) for expanded AR coefficients a and MA coefficients b. */
export function conditionalSumOfSquares(w: Float64Array, a: Float64Array, b: Float64Array, e: Float64Array): number {
  const n = w.length;
  const start = a.length;
  let ssq = 0;
  let used = 0;
  e.fill(0);
  for (let t = start; t < n; t++) {
    let v = w[t];
    for (let k = 0; k < a.length; k++) v -= a[k] * w[t - k - 1];
    for (let k = 0; k < b.length && k < t; k++) v -= b[k] * e[t - k - 1];
    if (v === v) {
      e[t] = v;
      ssq += v * v;
      used++;
    }
  }
  return used > 0 ? ssq / used : Infinity;
}

/**
 * The CSS estimate in unconstrained values (order ar, ma, sar, sma) of the centred series w, or
 * null when the search fails. `maxHours` keeps only the latest values: a start needs no more.
 */
export function cssStart(w: Float64Array, o: CssOrders, maxHours = 4000): Float64Array | null {
  const k = o.p + o.q + o.P + o.Q;
  if (k === 0) return new Float64Array(0);
  const x = w.length > maxHours ? w.subarray(w.length - maxHours) : w;
  const s = o.period || 1;
  const e = new Float64Array(x.length);
  const at = (u: Float64Array, from: number, len: number) => u.subarray(from, from + len);
  const terms = usableTerms(x, o.p + o.P * s);
  const lags = new SparseLags(o.p + o.P * s, o.q + o.Q * s);
  const small = o.P + o.Q === 0 && o.p <= 3 && o.q <= 3 ? smallOrderSeries(x, terms, o.p) : null;
  // without a seasonal block the polynomials are the coefficients: mapped without allocating
  const phi = new Float64Array(Math.max(o.p, 1));
  const theta = new Float64Array(Math.max(o.q, 1));
  const work = new Float64Array(Math.max(o.p, o.q, 1));
  const objective = (u: Float64Array): number => {
    if (small) {
      toStationaryInto(u, 0, o.p, phi, work, 1);
      toStationaryInto(u, o.p, o.q, theta, work, -1);
      return Math.log(smallOrderSumOfSquares(small, phi, theta, o.p, o.q, terms.length));
    }
    const a = expandAr(toStationary(at(u, 0, o.p)), toStationary(at(u, o.p + o.q, o.P)), s);
    const b = expandMa(toInvertible(at(u, o.p, o.q)), toInvertible(at(u, o.p + o.q + o.P, o.Q)), s);
    return Math.log(sparseSumOfSquares(x, lags.set(a, b), terms, e));
  };
  const r = minimizeBfgs(objective, new Float64Array(k), { maxIter: 100, gradTol: 1e-6, fTol: 1e-10, step: 1e-6 });
  return Number.isFinite(r.f) && r.x.every(Number.isFinite) ? r.x : null;
}

/**
 * The terms the recursion uses: w_t and every value of its AR window present. That is where
 * conditionalSumOfSquares finds a number (a missing value times even a zero coefficient is NaN),
 * found once per series instead of once per pass.
 */
function usableTerms(w: Float64Array, na: number): Int32Array {
  const out: number[] = [];
  for (let t = na; t < w.length; t++) {
    let ok = w[t] === w[t];
    for (let l = 1; ok && l <= na; l++) ok = w[t - l] === w[t - l];
    if (ok) out.push(t);
  }
  return Int32Array.from(out);
}

/**
 * The non-zero coefficients of the expanded polynomials and their lags: with a seasonal block
 * most of the 25–27 expanded coefficients are structural zeros. Leaving out a zero term changes
 * no digit of the sum (v − 0·w = v for finite w), so the search takes exactly the same path as
 * over the dense polynomials, in a fraction of the time.
 */
class SparseLags {
  aLag: Int32Array;
  aVal: Float64Array;
  aN = 0;
  bLag: Int32Array;
  bVal: Float64Array;
  bN = 0;
  constructor(na: number, nb: number) {
    this.aLag = new Int32Array(na);
    this.aVal = new Float64Array(na);
    this.bLag = new Int32Array(nb);
    this.bVal = new Float64Array(nb);
  }
  set(a: Float64Array, b: Float64Array): this {
    this.aN = 0;
    for (let k = 0; k < a.length; k++) {
      if (a[k] !== 0) {
        this.aLag[this.aN] = k + 1;
        this.aVal[this.aN++] = a[k];
      }
    }
    this.bN = 0;
    for (let k = 0; k < b.length; k++) {
      if (b[k] !== 0) {
        this.bLag[this.bN] = k + 1;
        this.bVal[this.bN++] = b[k];
      }
    }
    return this;
  }
}

/** conditionalSumOfSquares over the usable terms with the sparse polynomials. */
function sparseSumOfSquares(w: Float64Array, c: SparseLags, terms: Int32Array, e: Float64Array): number {
  const { aLag, aVal, aN, bLag, bVal, bN } = c;
  let ssq = 0;
  e.fill(0);
  for (let i = 0; i < terms.length; i++) {
    const t = terms[i];
    let v = w[t];
    for (let k = 0; k < aN; k++) v -= aVal[k] * w[t - aLag[k]];
    for (let k = 0; k < bN; k++) {
      const l = t - bLag[k];
      if (l >= 0) v -= bVal[k] * e[l];
    }
    e[t] = v;
    ssq += v * v;
  }
  return terms.length > 0 ? ssq / terms.length : Infinity;
}

/**
 * For AR and MA orders up to three without a seasonal block: the series behind three zeros,
 * missing values as zeros, and a mask of the usable terms. Every lag then reads a finite number,
 * and a zero coefficient beyond the order adds nothing (v − 0·w = v).
 */
interface SmallOrderSeries {
  xz: Float64Array;
  used: Uint8Array;
}

function smallOrderSeries(w: Float64Array, terms: Int32Array, na: number): SmallOrderSeries {
  const n = w.length;
  const xz = new Float64Array(n + 3);
  for (let t = 0; t < n; t++) xz[t + 3] = w[t] === w[t] ? w[t] : 0;
  const used = new Uint8Array(n);
  for (let i = 0; i < terms.length; i++) used[terms[i]] = 1;
  void na;
  return { xz, used };
}

/**
 * The recursion of conditionalSumOfSquares with the three coefficients and the last three
 * innovations in locals (no inner loops, no array of innovations): the same operations in the
 * same order, so the same sum to the last digit, several times faster on a pass that a CSS
 * search runs a few hundred times.
 */
function smallOrderSumOfSquares(c: SmallOrderSeries, a: Float64Array, b: Float64Array, na: number, nb: number, nTerms: number): number {
  const { xz, used } = c;
  const n = used.length;
  const a0 = na > 0 ? a[0] : 0;
  const a1 = na > 1 ? a[1] : 0;
  const a2 = na > 2 ? a[2] : 0;
  const b0 = nb > 0 ? b[0] : 0;
  const b1 = nb > 1 ? b[1] : 0;
  const b2 = nb > 2 ? b[2] : 0;
  let e1 = 0;
  let e2 = 0;
  let e3 = 0;
  let ssq = 0;
  for (let t = na; t < n; t++) {
    let v = 0;
    if (used[t]) {
      const i = t + 3;
      v = xz[i];
      v -= a0 * xz[i - 1];
      v -= a1 * xz[i - 2];
      v -= a2 * xz[i - 3];
      v -= b0 * e1;
      v -= b1 * e2;
      v -= b2 * e3;
      ssq += v * v;
    }
    e3 = e2;
    e2 = e1;
    e1 = v;
  }
  return nTerms > 0 ? ssq / nTerms : Infinity;
}
