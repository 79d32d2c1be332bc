/**
 * The conditional-sum-of-squares objective for any orders, with a seasonal block (css.ts), over
 * the expanded polynomials' non-zero coefficients, and its exact gradient.
 */
import { CssOrders, CssProblem, usableTerms } from './css-problem';
import { expandAr, expandMa, expansionAdjoint, filledLags } from './polynomials';
import { toInvertible, toStationary, toStationaryJacobian } from './transform';

/**
 * The CSS objective of any orders, with a seasonal block (P, Q)_s, over the expanded polynomials'
 * non-zero coefficients (SparseLags), and its exact gradient at the point of the last evaluation
 * by the backward pass of smallOrderCss run over the lags the expansion can fill:
 *   λ_t = 2 e_t − Σ_L b_L λ_{t+L},  ∂S/∂a_L = −Σ_t λ_t w_{t−L},  ∂S/∂b_L = −Σ_t λ_t e_{t−L},
 * carried to (φ, Φ, θ, Θ) through the products of the expansion (a_{js+i} = −φ_i Φ_j,
 * b_{js+i} = θ_i Θ_j; polynomials.ts) and to the unconstrained values through the transform's
 * Jacobians. With a seasonal block forward differences cost p + q + P + Q passes, this about two.
 */
export function generalCss(x: Float64Array, o: CssOrders, terms: Int32Array = usableTerms(x, o.p + o.P * o.period)): CssProblem {
  const { p, q, P, Q } = o;
  const s = o.period || 1;
  const k = p + q + P + Q;
  const at = (u: Float64Array, from: number, len: number) => u.subarray(from, from + len);
  const lags = new SparseLags(p + P * s, q + Q * s);
  const e = new Float64Array(x.length);
  const lambda = new Float64Array(x.length);
  // the lags each expanded polynomial can fill (1-based), whatever the values
  const arLags = filledLags(p, P, s);
  const maLags = filledLags(q, Q, s);
  const lastU = new Float64Array(k);
  let lastSsq = NaN;
  const objective = (u: Float64Array): number => {
    const a = expandAr(toStationary(at(u, 0, p)), toStationary(at(u, p + q, P)), s);
    const b = expandMa(toInvertible(at(u, p, q)), toInvertible(at(u, p + q + P, Q)), s);
    const ms = sparseSumOfSquares(x, lags.set(a, b), terms, e);
    lastU.set(u);
    lastSsq = ms * terms.length;
    return Math.log(ms);
  };
  const gradient = (u: Float64Array): Float64Array | null => {
    if (!(lastSsq > 0)) return null;
    for (let i = 0; i < k; i++) if (u[i] !== lastU[i]) return null;
    // ∂S/∂a_L and ∂S/∂b_L at the filled lags, dense by lag (index L − 1)
    const dA = new Float64Array(p + P * s);
    const dB = new Float64Array(q + Q * s);
    sparseAdjoint(x, e, lambda, terms, lags, arLags, maLags, dA, dB);
    const ar = toStationaryJacobian(at(u, 0, p));
    const ma = toStationaryJacobian(at(u, p, q));
    const sar = toStationaryJacobian(at(u, p + q, P));
    const sma = toStationaryJacobian(at(u, p + q + P, Q));
    // θ and Θ are −toStationary: their values and Jacobians change sign
    const theta = ma.phi.map((v) => -v);
    const stheta = sma.phi.map((v) => -v);
    // ∂S with respect to φ, Φ and θ, Θ through the expansion
    const { dc: dPhi, dC: dSphi } = expansionAdjoint(dA, ar.phi, sar.phi, s, -1);
    const { dc: dTheta, dC: dStheta } = expansionAdjoint(dB, theta, stheta, s, 1);
    const g = new Float64Array(k);
    const chain = (d: Float64Array, jac: Float64Array, m: number, from: number, sign: number) => {
      for (let j = 0; j < m; j++) {
        let v = 0;
        for (let i = 0; i < m; i++) v += d[i] * jac[j * m + i];
        g[from + j] = (sign * v) / lastSsq;
      }
    };
    chain(dPhi, ar.jac, p, 0, 1);
    chain(dTheta, ma.jac, q, p, -1);
    chain(dSphi, sar.jac, P, p + q, 1);
    chain(dStheta, sma.jac, Q, p + q + P, -1);
    return g;
  };
  return { objective, gradient };
}

/** The backward pass of generalCss over the last evaluation's innovations e; writes dA, dB at the filled lags. */
function sparseAdjoint(
  w: Float64Array,
  e: Float64Array,
  lambda: Float64Array,
  terms: Int32Array,
  c: SparseLags,
  arLags: Int32Array,
  maLags: Int32Array,
  dA: Float64Array,
  dB: Float64Array,
): void {
  const { bLag, bVal, bN } = c;
  const n = w.length;
  lambda.fill(0);
  for (let i = terms.length - 1; i >= 0; i--) {
    const t = terms[i];
    let l = 2 * e[t];
    for (let k = 0; k < bN; k++) {
      const f = t + bLag[k];
      if (f < n) l -= bVal[k] * lambda[f];
    }
    lambda[t] = l;
    for (let k = 0; k < arLags.length; k++) dA[arLags[k] - 1] -= l * w[t - arLags[k]];
    for (let k = 0; k < maLags.length; k++) {
      const from = t - maLags[k];
      if (from >= 0) dB[maLags[k] - 1] -= l * e[from];
    }
  }
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
