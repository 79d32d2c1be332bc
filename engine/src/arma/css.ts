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
import { toInvertible, toStationary, toStationaryInto, toStationaryJacobian } from './transform';

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
  const at = (u: Float64Array, from: number, len: number) => u.subarray(from, from + len);
  const terms = usableTerms(x, o.p + o.P * s);
  const lags = new SparseLags(o.p + o.P * s, o.q + o.Q * s);
  const small = o.P + o.Q === 0 && o.p <= 3 && o.q <= 3 ? smallOrderCss(x, o.p, o.q, terms) : null;
  const e = new Float64Array(small ? 0 : x.length);
  const objective = small
    ? small.objective
    : (u: Float64Array): number => {
        const a = expandAr(toStationary(at(u, 0, o.p)), toStationary(at(u, o.p + o.q, o.P)), s);
        const b = expandMa(toInvertible(at(u, o.p, o.q)), toInvertible(at(u, o.p + o.q + o.P, o.Q)), s);
        return Math.log(sparseSumOfSquares(x, lags.set(a, b), terms, e));
      };
  const r = minimizeBfgs(objective, new Float64Array(k), { maxIter: 100, gradTol: 1e-6, fTol: 1e-10, step: 1e-6, gradient: small?.gradient });
  return Number.isFinite(r.f) && r.x.every(Number.isFinite) ? r.x : null;
}

/**
 * The CSS objective log(Σ e_t² / m) of ARMA(p, q), p, q ≤ 3, no seasonal block, in the
 * unconstrained values, and its gradient at the point of the last evaluation (null elsewhere:
 * the search then falls back to differences). The gradient is exact, by one backward (adjoint)
 * pass over the innovations the evaluation kept: about the cost of one more evaluation, where
 * forward differences cost p + q of them (on the daily-differenced demand series the CSS search
 * of ARMA(3,2) went from 461 evaluations to 91 and from 2.9 to 1.3 ms).
 */
export function smallOrderCss(
  x: Float64Array,
  p: number,
  q: number,
  terms: Int32Array = usableTerms(x, p),
): { objective: (u: Float64Array) => number; gradient: (u: Float64Array) => Float64Array | null } {
  const k = p + q;
  const series = smallOrderSeries(x, terms);
  const phi = new Float64Array(Math.max(p, 1));
  const theta = new Float64Array(Math.max(q, 1));
  const work = new Float64Array(Math.max(p, q, 1));
  const lastU = new Float64Array(k);
  let lastSsq = NaN;
  const objective = (u: Float64Array): number => {
    toStationaryInto(u, 0, p, phi, work, 1);
    toStationaryInto(u, p, q, theta, work, -1);
    const ms = smallOrderSumOfSquares(series, phi, theta, p, q, terms.length);
    lastU.set(u);
    lastSsq = ms * terms.length;
    return Math.log(ms);
  };
  const gradient = (u: Float64Array): Float64Array | null => {
    if (!(lastSsq > 0)) return null;
    for (let i = 0; i < k; i++) if (u[i] !== lastU[i]) return null;
    return smallOrderObjectiveGradient(series, u, p, q, lastSsq, theta);
  };
  return { objective, gradient };
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
  /** the last pass's innovations behind three zeros (ez[t + 3] = e_t), for the gradient */
  ez: Float64Array;
}

function smallOrderSeries(w: Float64Array, terms: Int32Array): SmallOrderSeries {
  const n = w.length;
  const xz = new Float64Array(n + 3);
  for (let t = 0; t < n; t++) xz[t + 3] = w[t] === w[t] ? w[t] : 0;
  const used = new Uint8Array(n);
  for (let i = 0; i < terms.length; i++) used[terms[i]] = 1;
  return { xz, used, ez: new Float64Array(n + 3) };
}

/**
 * The recursion of conditionalSumOfSquares with the three coefficients and the last three
 * innovations in locals (no inner loops, no array of innovations): the same operations in the
 * same order, so the same sum to the last digit, several times faster on a pass that a CSS
 * search runs a few hundred times.
 */
function smallOrderSumOfSquares(c: SmallOrderSeries, a: Float64Array, b: Float64Array, na: number, nb: number, nTerms: number): number {
  const { xz, used, ez } = c;
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
    ez[t + 3] = v;
    e3 = e2;
    e2 = e1;
    e1 = v;
  }
  return nTerms > 0 ? ssq / nTerms : Infinity;
}

/**
 * The gradient of log(S / m) in the unconstrained values, S = Σ e_t² of the last pass of
 * smallOrderSumOfSquares (its innovations in c.ez, its MA coefficients b), by reverse-mode
 * differentiation of the recursion (the adjoint method; Griewank & Walther 2008, ch. 3):
 *   λ_t = 2 e_t − Σ_k b_k λ_{t+k}   (λ_t = 0 where the term is not used: e_t is then a constant 0),
 *   ∂S/∂a_k = −Σ_t λ_t w_{t−k},   ∂S/∂b_k = −Σ_t λ_t e_{t−k},
 * then carried to the unconstrained values through the Jacobian of the partial-autocorrelation
 * transform (θ = −toStationary, hence the sign of the MA part).
 */
function smallOrderObjectiveGradient(c: SmallOrderSeries, u: Float64Array, na: number, nb: number, ssq: number, b: Float64Array): Float64Array {
  const b0 = nb > 0 ? b[0] : 0;
  const b1 = nb > 1 ? b[1] : 0;
  const b2 = nb > 2 ? b[2] : 0;
  // the arrays as arguments of a function of their own: read through the object inside the
  // loop, the compiled loop was thrown away again and again (20–28 ns a term instead of ~5)
  const d = smallOrderAdjoint(c.xz, c.used, c.ez, na, b0, b1, b2);
  const g = new Float64Array(na + nb);
  const ar = toStationaryJacobian(u.subarray(0, na));
  const ma = toStationaryJacobian(u.subarray(na, na + nb));
  for (let j = 0; j < na; j++) {
    let s = 0;
    for (let i = 0; i < na; i++) s += d[i] * ar.jac[j * na + i];
    g[j] = s / ssq;
  }
  for (let j = 0; j < nb; j++) {
    let s = 0;
    for (let i = 0; i < nb; i++) s -= d[3 + i] * ma.jac[j * nb + i];
    g[na + j] = s / ssq;
  }
  return g;
}

/** The backward pass of smallOrderObjectiveGradient: ∂S/∂a_1..3 and ∂S/∂b_1..3, in that order. */
function smallOrderAdjoint(xz: Float64Array, used: Uint8Array, ez: Float64Array, na: number, b0: number, b1: number, b2: number): Float64Array {
  const n = used.length;
  let l1 = 0;
  let l2 = 0;
  let l3 = 0;
  let ga0 = 0;
  let ga1 = 0;
  let ga2 = 0;
  let gb0 = 0;
  let gb1 = 0;
  let gb2 = 0;
  for (let t = n - 1; t >= na; t--) {
    let l = 0;
    if (used[t]) {
      const i = t + 3;
      l = 2 * ez[i] - b0 * l1 - b1 * l2 - b2 * l3;
      ga0 -= l * xz[i - 1];
      ga1 -= l * xz[i - 2];
      ga2 -= l * xz[i - 3];
      gb0 -= l * ez[i - 1];
      gb1 -= l * ez[i - 2];
      gb2 -= l * ez[i - 3];
    }
    l3 = l2;
    l2 = l1;
    l1 = l;
  }
  const d = new Float64Array(6);
  d[0] = ga0;
  d[1] = ga1;
  d[2] = ga2;
  d[3] = gb0;
  d[4] = gb1;
  d[5] = gb2;
  return d;
}
