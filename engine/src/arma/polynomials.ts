/**
 * Lag polynomials of ARMA models (Box & Jenkins 1970): the multiplicative seasonal model
 * φ(B)Φ(B^s) w_t = θ(B)Θ(B^s) ε_t is expanded into one AR polynomial 1 − Σ a_k B^k and one MA
 * polynomial 1 + Σ b_k B^k, and ψ-weights of the MA(∞) form are computed from them.
 */

import { EigenvalueDecomposition, Matrix } from 'ml-matrix';

/** Expand φ(B)Φ(B^s) with AR sign convention (1 − Σφ_i B^i)(1 − ΣΦ_j B^{js}); returns a_1..a_K. */
export function expandAr(phi: ArrayLike<number>, sphi: ArrayLike<number>, s: number): Float64Array {
  const p = phi.length;
  const P = sphi.length;
  const K = p + P * s;
  const out = new Float64Array(K);
  for (let i = 0; i < p; i++) out[i] += phi[i];
  for (let j = 0; j < P; j++) {
    out[(j + 1) * s - 1] += sphi[j];
    for (let i = 0; i < p; i++) out[(j + 1) * s + i] -= phi[i] * sphi[j];
  }
  return out;
}

/** Expand θ(B)Θ(B^s) with MA sign convention (1 + Σθ_i B^i)(1 + ΣΘ_j B^{js}); returns b_1..b_K. */
export function expandMa(theta: ArrayLike<number>, stheta: ArrayLike<number>, s: number): Float64Array {
  const q = theta.length;
  const Q = stheta.length;
  const K = q + Q * s;
  const out = new Float64Array(K);
  for (let i = 0; i < q; i++) out[i] += theta[i];
  for (let j = 0; j < Q; j++) {
    out[(j + 1) * s - 1] += stheta[j];
    for (let i = 0; i < q; i++) out[(j + 1) * s + i] += theta[i] * stheta[j];
  }
  return out;
}

/** Product of two polynomials given by full coefficient vectors (index = power). */
export function multiply(x: ArrayLike<number>, y: ArrayLike<number>): Float64Array {
  const out = new Float64Array(x.length + y.length - 1);
  for (let i = 0; i < x.length; i++) for (let j = 0; j < y.length; j++) out[i + j] += x[i] * y[j];
  return out;
}

/**
 * Derivative of expandAr along (dphi, dsphi): the product is bilinear, so it is the product
 * with each factor replaced by its derivative in turn (AR signs: the cross terms subtract).
 */
export function expandArTangent(phi: ArrayLike<number>, sphi: ArrayLike<number>, dphi: ArrayLike<number>, dsphi: ArrayLike<number>, s: number): Float64Array {
  const p = phi.length;
  const P = sphi.length;
  const out = new Float64Array(p + P * s);
  for (let i = 0; i < p; i++) out[i] += dphi[i];
  for (let j = 0; j < P; j++) {
    out[(j + 1) * s - 1] += dsphi[j];
    for (let i = 0; i < p; i++) out[(j + 1) * s + i] -= dphi[i] * sphi[j] + phi[i] * dsphi[j];
  }
  return out;
}

/** Derivative of expandMa along (dtheta, dstheta), as expandArTangent with MA signs. */
export function expandMaTangent(theta: ArrayLike<number>, stheta: ArrayLike<number>, dtheta: ArrayLike<number>, dstheta: ArrayLike<number>, s: number): Float64Array {
  const q = theta.length;
  const Q = stheta.length;
  const out = new Float64Array(q + Q * s);
  for (let i = 0; i < q; i++) out[i] += dtheta[i];
  for (let j = 0; j < Q; j++) {
    out[(j + 1) * s - 1] += dstheta[j];
    for (let i = 0; i < q; i++) out[(j + 1) * s + i] += dtheta[i] * stheta[j] + theta[i] * dstheta[j];
  }
  return out;
}

/**
 * The adjoint (transpose) of the expansion's derivative: given d = ∂S/∂(expanded coefficients),
 * by lag (index L − 1), the derivatives of S with respect to the factors' coefficients c and C,
 * for (1 ∓ Σ c_i B^i)(1 ∓ Σ C_j B^{js}) with sign −1 (expandAr) or +1 (expandMa):
 *   ∂S/∂c_i = d_i + sign Σ_j d_{js+i} C_j,   ∂S/∂C_j = d_{js} + sign Σ_i d_{js+i} c_i
 * (indices 1-based in the formulas). The reverse-mode partner of expandArTangent /
 * expandMaTangent, for gradients that come back by lag from one backward pass.
 */
export function expansionAdjoint(d: ArrayLike<number>, c: ArrayLike<number>, C: ArrayLike<number>, s: number, sign: 1 | -1): { dc: Float64Array; dC: Float64Array } {
  const m = c.length;
  const M = C.length;
  const dc = new Float64Array(m);
  const dC = new Float64Array(M);
  for (let i = 0; i < m; i++) {
    let v = d[i];
    for (let j = 0; j < M; j++) v += sign * d[(j + 1) * s + i] * C[j];
    dc[i] = v;
  }
  for (let j = 0; j < M; j++) {
    let v = d[(j + 1) * s - 1];
    for (let i = 0; i < m; i++) v += sign * d[(j + 1) * s + i] * c[i];
    dC[j] = v;
  }
  return { dc, dC };
}

/** The lags (1-based) that (1 ∓ Σ c_i B^i)(1 ∓ Σ C_j B^{js}), with m and M coefficients, can fill: 1..m, js, js + i. */
export function filledLags(m: number, M: number, s: number): Int32Array {
  const set = new Set<number>();
  for (let i = 1; i <= m; i++) set.add(i);
  for (let j = 1; j <= M; j++) {
    set.add(j * s);
    for (let i = 1; i <= m; i++) set.add(j * s + i);
  }
  return Int32Array.from([...set].sort((a, b) => a - b));
}

/**
 * The reciprocals of the roots of 1 + c₁z + … + c_m z^m (real and imaginary parts): the
 * eigenvalues of the companion matrix of z^m + c₁z^{m−1} + … + c_m, its reversed polynomial.
 * A root at infinity (c_m = 0) gives a reciprocal of 0.
 */
export function reciprocalRoots(c: ArrayLike<number>): { re: number[]; im: number[] } {
  const m = c.length;
  if (m === 0) return { re: [], im: [] };
  const companion = Matrix.zeros(m, m);
  for (let j = 0; j < m; j++) companion.set(0, j, -c[j]);
  for (let i = 1; i < m; i++) companion.set(i, i - 1, 1);
  const evd = new EigenvalueDecomposition(companion, { assumeSymmetric: false });
  return { re: evd.realEigenvalues, im: evd.imaginaryEigenvalues };
}
