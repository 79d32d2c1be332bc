/**
 * State-space form of an ARMA model (Harvey 1989, §3.3; Durbin & Koopman 2012, §3.4):
 * y_t = Z α_t with Z = (1, 0, …, 0), α_t = T α_{t−1} + R ε_t, r = max(p, q + 1), T with the AR
 * coefficients in its first column and ones on the superdiagonal, R = (1, θ_1, …, θ_{r−1})'.
 *
 * The initial state covariance is the stationary solution of P = T P T' + R R' (in units of σ²),
 * found as Gardner, Harvey & Phillips (1980) do by solving the linear system in the r(r+1)/2
 * distinct elements of P. For large r (seasonal blocks at long periods) that system is too big;
 * there P is built from the process's autocovariances, which costs little for the few non-zero
 * coefficients of a seasonal model (autocovariance-covariance.ts), and where that system is
 * singular the convergent series P = Σ_k (T^k R)(T^k R)' is summed by doubling
 * (doubling-covariance.ts); `seriesCovariance` sums it term by term (the tangents still do).
 */

import { autocovarianceCovariance } from './autocovariance-covariance';
import { doublingCovariance } from './doubling-covariance';
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
  if (ss.r <= GARDNER_MAX_R) return gardnerCovariance(ss, out);
  return autocovarianceCovariance(ss.r, ss.phi, ss.R, out) ?? doublingCovariance(ss.r, ss.phi, ss.R);
}

/**
 * The first row of the stationary covariance (and its first column) in out[0..r), the rest of
 * out unspecified: what the likelihood's Chandrasekhar start-up reads of P (kalman.ts). For a
 * large state that is one row of the autocovariance sum instead of all of them.
 */
export function stationaryCovarianceFirstRow(ss: ArmaStateSpace, out: Float64Array): Float64Array {
  if (ss.r <= GARDNER_MAX_R) return gardnerCovariance(ss, out);
  return autocovarianceCovariance(ss.r, ss.phi, ss.R, out, 1) ?? doublingCovariance(ss.r, ss.phi, ss.R);
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
  const A = gardnerSystem(ss);
  const b = scratch('gardner.b', m);
  for (let i = 0; i < r; i++) for (let j = i; j < r; j++) b[idx[i * w + j]] = R[i] * R[j];
  const piv = pivotsOf(m);
  luFactorInPlace(A, m, piv);
  luSolveInPlace(A, m, piv, b);
  for (let i = 0; i < r; i++) for (let j = 0; j < r; j++) P[i * r + j] = b[idx[i * w + j]];
  return P;
}

/** The matrix I − T⊗T of Gardner's system on the upper triangle, m×m (m = r(r+1)/2), in scratch. */
function gardnerSystem(ss: ArmaStateSpace): Float64Array {
  const { r, phi } = ss;
  const m = (r * (r + 1)) / 2;
  const w = r + 1;
  const idx = triangleOf(r);
  const A = scratch('gardner.A', m * m);
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
    }
  }
  return A;
}

/**
 * The first row of the stationary covariance P and its derivatives along k directions, given
 * as the derivatives of φ and R (row-major k×r each). Differentiating P = T P T' + R R' gives
 * the same equation for dP with another right-hand side,
 *   dP − T dP T' = dT P T' + T P dT' + dR R' + R dR',  dT = dφ e₀',
 * and (dT P T')_ij = dφ_i q_j with q = T P e₀, so one factorisation of Gardner's system serves
 * P and all its derivatives. Beyond the sizes Gardner's system is used for, the series form.
 */
export function stationaryCovarianceTangents(ss: ArmaStateSpace, dPhi: Float64Array, dR: Float64Array, k: number): { row: Float64Array; dRow: Float64Array } {
  if (ss.r > GARDNER_MAX_R) return seriesCovarianceTangents(ss, dPhi, dR, k);
  const { P, dP } = gardnerTangents(ss, dPhi, dR, k, 1);
  return { row: P, dRow: dP };
}

/**
 * The whole stationary covariance P (row-major r×r) and its derivatives along the k directions
 * (k blocks of r×r), by the same factorisation of Gardner's system; null beyond the sizes that
 * system is used for. What the filter through missing values differentiates (gap-score.ts).
 */
export function stationaryCovarianceFullTangents(ss: ArmaStateSpace, dPhi: Float64Array, dR: Float64Array, k: number): { P: Float64Array; dP: Float64Array } | null {
  return ss.r > GARDNER_MAX_R ? null : gardnerTangents(ss, dPhi, dR, k, ss.r);
}

/** P's first `rows` rows and their derivatives along the k directions (k blocks of rows·r). */
function gardnerTangents(ss: ArmaStateSpace, dPhi: Float64Array, dR: Float64Array, k: number, rows: number): { P: Float64Array; dP: Float64Array } {
  const { r, phi, R } = ss;
  const m = (r * (r + 1)) / 2;
  const w = r + 1;
  const idx = triangleOf(r);
  const A = gardnerSystem(ss);
  const piv = pivotsOf(m);
  luFactorInPlace(A, m, piv);
  const b = scratch('tangents.b', m);
  for (let i = 0; i < r; i++) for (let j = i; j < r; j++) b[idx[i * w + j]] = R[i] * R[j];
  luSolveInPlace(A, m, piv, b);
  const size = rows * r;
  const P = new Float64Array(size);
  for (let i = 0; i < rows; i++) for (let j = 0; j < r; j++) P[i * r + j] = b[idx[i * w + j]];
  // q_j = (T P)_{j0} = φ_j P_00 + P_{j+1,0}
  const q = scratch('tangents.q', r);
  for (let j = 0; j < r; j++) q[j] = phi[j] * b[idx[0]] + (j + 1 < r ? b[idx[j + 1]] : 0);
  const dP = new Float64Array(k * size);
  const rhs = scratch('tangents.rhs', m);
  for (let h = 0; h < k; h++) {
    const o = h * r;
    for (let i = 0; i < r; i++) {
      for (let j = i; j < r; j++) {
        rhs[idx[i * w + j]] = dPhi[o + i] * q[j] + q[i] * dPhi[o + j] + dR[o + i] * R[j] + R[i] * dR[o + j];
      }
    }
    luSolveInPlace(A, m, piv, rhs);
    const od = h * size;
    for (let i = 0; i < rows; i++) for (let j = 0; j < r; j++) dP[od + i * r + j] = rhs[idx[i * w + j]];
  }
  return { P, dP };
}

/**
 * The same for the series form (seriesCovariance): the first row of P is Σ g_k[0] g_k, and
 * along a direction dg_{k+1} = dT g_k + T dg_k, dg_0 = dR. Summed over the same terms.
 */
export function seriesCovarianceTangents(ss: ArmaStateSpace, dPhi: Float64Array, dR: Float64Array, k: number, maxTerms = 200000): { row: Float64Array; dRow: Float64Array } {
  const { r, phi, R } = ss;
  const row = new Float64Array(r);
  const dRow = new Float64Array(k * r);
  let g = Float64Array.from(R);
  let next = new Float64Array(r);
  let dg = Float64Array.from(dR);
  let dnext = new Float64Array(k * r);
  let trace = 0;
  for (let term = 0; term < maxTerms; term++) {
    let norm = 0;
    for (let i = 0; i < r; i++) norm += g[i] * g[i];
    const g0 = g[0];
    for (let j = 0; j < r; j++) row[j] += g0 * g[j];
    for (let h = 0; h < k; h++) {
      const o = h * r;
      const dg0 = dg[o];
      for (let j = 0; j < r; j++) dRow[o + j] += dg0 * g[j] + g0 * dg[o + j];
    }
    trace += norm;
    if (term > r && norm <= 1e-15 * trace) break;
    for (let i = 0; i < r - 1; i++) next[i] = phi[i] * g0 + g[i + 1];
    next[r - 1] = phi[r - 1] * g0;
    for (let h = 0; h < k; h++) {
      const o = h * r;
      const dg0 = dg[o];
      for (let i = 0; i < r - 1; i++) dnext[o + i] = dPhi[o + i] * g0 + phi[i] * dg0 + dg[o + i + 1];
      dnext[o + r - 1] = dPhi[o + r - 1] * g0 + phi[r - 1] * dg0;
    }
    [g, next] = [next, g];
    [dg, dnext] = [dnext, dg];
  }
  return { row, dRow };
}

const pivots = new Map<number, Int32Array>();
function pivotsOf(m: number): Int32Array {
  let p = pivots.get(m);
  if (!p) {
    p = new Int32Array(m);
    pivots.set(m, p);
  }
  return p;
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
 * LU factorisation with partial pivoting of a small dense matrix (row-major, m×m), in place:
 * the multipliers below the diagonal, U on and above it, the row swaps in `piv`.
 */
function luFactorInPlace(a: Float64Array, m: number, piv: Int32Array): void {
  for (let c = 0; c < m; c++) {
    let pr = c;
    let best = Math.abs(a[c * m + c]);
    for (let rr = c + 1; rr < m; rr++) {
      const v = Math.abs(a[rr * m + c]);
      if (v > best) {
        best = v;
        pr = rr;
      }
    }
    if (best === 0) throw new Error('singular system for the stationary covariance');
    piv[c] = pr;
    if (pr !== c) {
      for (let k = 0; k < m; k++) {
        const t = a[c * m + k];
        a[c * m + k] = a[pr * m + k];
        a[pr * m + k] = t;
      }
    }
    const d = a[c * m + c];
    for (let rr = c + 1; rr < m; rr++) {
      const f = a[rr * m + c] / d;
      a[rr * m + c] = f;
      if (f === 0) continue;
      for (let k = c + 1; k < m; k++) a[rr * m + k] -= f * a[c * m + k];
    }
  }
}

/** Solves with the factors of luFactorInPlace, overwriting b with the solution. */
function luSolveInPlace(a: Float64Array, m: number, piv: Int32Array, b: Float64Array): void {
  // every row swap first (the factors' rows were swapped whole, multipliers included), then L
  for (let c = 0; c < m; c++) {
    const pr = piv[c];
    if (pr !== c) {
      const t = b[c];
      b[c] = b[pr];
      b[pr] = t;
    }
  }
  for (let c = 0; c < m; c++) {
    const bc = b[c];
    if (bc !== 0) for (let rr = c + 1; rr < m; rr++) b[rr] -= a[rr * m + c] * bc;
  }
  for (let c = m - 1; c >= 0; c--) {
    let s = b[c];
    for (let k = c + 1; k < m; k++) s -= a[c * m + k] * b[k];
    b[c] = s / a[c * m + c];
  }
}
