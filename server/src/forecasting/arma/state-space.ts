/**
 * State-space form of an ARMA model (Harvey 1989, §3.3; Durbin & Koopman 2012, §3.4):
 * y_t = Z α_t with Z = (1, 0, …, 0), α_t = T α_{t−1} + R ε_t, r = max(p, q + 1), T with the AR
 * coefficients in its first column and ones on the superdiagonal, R = (1, θ_1, …, θ_{r−1})'.
 *
 * The initial state covariance is the stationary solution of P = T P T' + R R' (in units of σ²),
 * found as Gardner, Harvey & Phillips (1980) do by solving the linear system in the r(r+1)/2
 * distinct elements of P. For large r (seasonal blocks at long periods) that system is too big;
 * there we sum the same solution as the convergent series P = Σ_k (T^k R)(T^k R)', which is
 * cheap because R R' has rank one.
 */

import { scratch } from './scratch';

export interface ArmaStateSpace {
  r: number;
  /** AR coefficients padded with zeros to length r. */
  phi: Float64Array;
  /** (1, θ_1, …, θ_{r−1}), padded with zeros. */
  R: Float64Array;
}

export function armaStateSpace(ar: ArrayLike<number>, ma: ArrayLike<number>): ArmaStateSpace {
  const r = Math.max(ar.length, ma.length + 1, 1);
  const phi = new Float64Array(r);
  const R = new Float64Array(r);
  for (let i = 0; i < ar.length; i++) phi[i] = ar[i];
  R[0] = 1;
  for (let i = 0; i < ma.length; i++) R[i + 1] = ma[i];
  return { r, phi, R };
}

const GARDNER_MAX_R = 12;

/** Stationary covariance of the state, row-major r×r, in units of σ² (into `out` when it has that size). */
export function stationaryCovariance(ss: ArmaStateSpace, out?: Float64Array): Float64Array {
  return ss.r <= GARDNER_MAX_R ? gardnerCovariance(ss, out) : seriesCovariance(ss);
}

/** Position of (i, j), i ≤ j, in the row-wise upper triangle of an r×r matrix, for each r. */
const triangleIndex = new Map<number, Int32Array>();
function triangleOf(r: number): Int32Array {
  let idx = triangleIndex.get(r);
  if (!idx) {
    idx = new Int32Array((r + 1) * (r + 1)).fill(-1);
    let k = 0;
    for (let i = 0; i < r; i++) for (let j = i; j < r; j++) idx[i * (r + 1) + j] = idx[j * (r + 1) + i] = k++;
    triangleIndex.set(r, idx);
  }
  return idx;
}

/**
 * Gardner, Harvey & Phillips (1980): solve (I − T⊗T) vec P = vec RR' on the upper triangle.
 * It runs once per likelihood evaluation, so the system is built from a cached index table
 * (row and column r of the table are −1: the zero padding of the shift structure) in scratch
 * arrays and solved in place.
 */
export function gardnerCovariance(ss: ArmaStateSpace, out?: Float64Array): Float64Array {
  const { r, phi, R } = ss;
  // written whole below, so a reused `out` needs no clearing
  const P = out && out.length === r * r ? out : new Float64Array(r * r);
  if (r === 1) {
    P[0] = (R[0] * R[0]) / (1 - phi[0] * phi[0]);
    return P;
  }
  const m = (r * (r + 1)) / 2;
  const w = r + 1;
  const idx = triangleOf(r);
  const A = scratch('gardner.A', m * m);
  const b = scratch('gardner.b', m);
  for (let i = 0; i < r; i++) {
    for (let j = i; j < r; j++) {
      const row = idx[i * w + j] * m;
      A[row + idx[i * w + j]] += 1;
      // (T P T')_ij = φ_i φ_j P_00 + φ_i P_{0,j+1} + φ_j P_{i+1,0} + P_{i+1,j+1}
      A[row] -= phi[i] * phi[j];
      const a = idx[j + 1];
      if (a >= 0) A[row + a] -= phi[i];
      const c = idx[(i + 1) * w];
      if (c >= 0) A[row + c] -= phi[j];
      const d = idx[(i + 1) * w + j + 1];
      if (d >= 0) A[row + d] -= 1;
      b[idx[i * w + j]] = R[i] * R[j];
    }
  }
  const x = solveDenseInPlace(A, b, m);
  for (let i = 0; i < r; i++) for (let j = 0; j < r; j++) P[i * r + j] = x[idx[i * w + j]];
  return P;
}

/** P = Σ_k g_k g_k', g_0 = R, g_{k+1} = T g_k, summed until the terms are negligible. */
export function seriesCovariance(ss: ArmaStateSpace, maxTerms = 200000): Float64Array {
  const { r, phi, R } = ss;
  const P = new Float64Array(r * r);
  let g = Float64Array.from(R);
  const next = new Float64Array(r);
  let trace = 0;
  for (let k = 0; k < maxTerms; k++) {
    let norm = 0;
    for (let i = 0; i < r; i++) {
      const gi = g[i];
      if (gi === 0) continue;
      norm += gi * gi;
      const row = i * r;
      for (let j = 0; j < r; j++) P[row + j] += gi * g[j];
    }
    trace += norm;
    if (k > r && norm <= 1e-15 * trace) break;
    const g0 = g[0];
    for (let i = 0; i < r - 1; i++) next[i] = phi[i] * g0 + g[i + 1];
    next[r - 1] = phi[r - 1] * g0;
    const t = g;
    g = next.slice();
    t.fill(0);
  }
  return P;
}

/**
 * Gaussian elimination with partial pivoting on a small dense system (row-major A, m×m),
 * overwriting A and b; returns b, which then holds the solution.
 */
function solveDenseInPlace(a: Float64Array, x: Float64Array, m: number): Float64Array {
  for (let c = 0; c < m; c++) {
    let piv = c;
    let best = Math.abs(a[c * m + c]);
    for (let rr = c + 1; rr < m; rr++) {
      const v = Math.abs(a[rr * m + c]);
      if (v > best) {
        best = v;
        piv = rr;
      }
    }
    if (best === 0) throw new Error('singular system for the stationary covariance');
    if (piv !== c) {
      for (let k = 0; k < m; k++) {
        const t = a[c * m + k];
        a[c * m + k] = a[piv * m + k];
        a[piv * m + k] = t;
      }
      const t = x[c];
      x[c] = x[piv];
      x[piv] = t;
    }
    const d = a[c * m + c];
    for (let rr = c + 1; rr < m; rr++) {
      const f = a[rr * m + c] / d;
      if (f === 0) continue;
      for (let k = c; k < m; k++) a[rr * m + k] -= f * a[c * m + k];
      x[rr] -= f * x[c];
    }
  }
  for (let c = m - 1; c >= 0; c--) {
    let s = x[c];
    for (let k = c + 1; k < m; k++) s -= a[c * m + k] * x[k];
    x[c] = s / a[c * m + c];
  }
  return x;
}
