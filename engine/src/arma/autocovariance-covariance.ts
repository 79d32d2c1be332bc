/**
 * The stationary state covariance P of a large, sparse ARMA state (a seasonal block at lag 24
 * makes r about 28 with a handful of non-zero coefficients) from the process's autocovariances,
 * in O(r² · s²) for s non-zero coefficients instead of the O(r³) steps of doubling.
 *
 * In the state-space form of ./state-space (T with φ in its first column and ones on the
 * superdiagonal, R = (1, θ_1, …, θ_{r−1})'), unrolling α_{t+1,i} = φ_{i+1} α_{t,0} + α_{t,i+1}
 * + θ_i ε_{t+1} gives each state element as a finite sum of past values and shocks
 * (Harvey 1989, §3.3; Durbin & Koopman 2012, §3.4):
 *   α_{t,i} = Σ_{k=0}^{r−1−i} ( φ_{i+k+1} y_{t−1−k} + θ_{i+k} ε_{t−k} ),
 * so, with σ² = 1, γ(h) = Cov(y_t, y_{t−h}) and Cov(y_s, ε_u) = ψ_{s−u} (zero for s < u),
 *   P_ij = Σ_k Σ_l [ φ_{i+k+1} φ_{j+l+1} γ(k−l) + φ_{i+k+1} θ_{j+l} ψ_{l−1−k}
 *                    + θ_{i+k} φ_{j+l+1} ψ_{k−1−l} + θ_{i+k} θ_{j+l} δ_{kl} ].
 * The ψ weights follow ψ_j = θ_j + Σ_i φ_i ψ_{j−i}; the autocovariances γ(0..p) solve the
 * linear system γ(k) − Σ_i φ_i γ(|k−i|) = Σ_{j≥k} θ_j ψ_{j−k}, k = 0..p (Brockwell & Davis,
 * Time Series: Theory and Methods, 2nd ed. 1991, §3.3, the third method), and the recursion
 * continues them beyond p. Checked against the doubling sum and R's makeARIMA in
 * autocovariance-covariance.spec.ts. Returns null when the system is singular (a unit root):
 * the caller falls back to doubling.
 */
import { scratch } from './scratch';

/**
 * With `rows` < r only the first `rows` rows (and, by symmetry, columns) are filled: the
 * likelihood's Chandrasekhar start-up needs no more than the first row (kalman.ts), which costs
 * O(r · s²) instead of O(r² · s²).
 */
export function autocovarianceCovariance(r: number, phi: Float64Array, R: Float64Array, out?: Float64Array, rows = r): Float64Array | null {
  let p = 0;
  for (let i = 0; i < r; i++) if (phi[i] !== 0) p = i + 1;
  let q = 0;
  for (let i = 1; i < r; i++) if (R[i] !== 0) q = i;
  // ψ_0..ψ_r
  const psi = scratch('acov.psi', r + 1);
  for (let j = 0; j <= r; j++) {
    let s = j < r ? R[j] : 0;
    for (let i = 1; i <= Math.min(j, p); i++) s += phi[i - 1] * psi[j - i];
    psi[j] = s;
  }
  // right-hand sides g_k = Σ_{j=k}^{q} θ_j ψ_{j−k} (θ_0 = 1), k = 0..r
  const g = scratch('acov.g', r + 1);
  for (let k = 0; k <= r; k++) {
    let s = 0;
    for (let j = k; j <= q; j++) s += R[j] * psi[j - k];
    g[k] = s;
  }
  // γ(0..p) from the (p+1)×(p+1) system, solved by Gaussian elimination with partial pivoting
  const m = p + 1;
  const A = scratch('acov.A', m * m);
  A.fill(0);
  const b = scratch('acov.b', m);
  for (let k = 0; k <= p; k++) {
    A[k * m + k] += 1;
    for (let i = 1; i <= p; i++) A[k * m + Math.abs(k - i)] -= phi[i - 1];
    b[k] = g[k];
  }
  if (!solveInPlace(A, b, m)) return null;
  const gamma = scratch('acov.gamma', r + 1);
  for (let k = 0; k <= r; k++) {
    if (k <= p) {
      gamma[k] = b[k];
      continue;
    }
    let s = g[k];
    for (let i = 1; i <= p; i++) s += phi[i - 1] * gamma[k - i];
    gamma[k] = s;
  }
  if (!(gamma[0] > 0) || !Number.isFinite(gamma[0])) return null;
  const gam = (h: number) => gamma[h < 0 ? -h : h];
  const ps = (h: number) => (h >= 0 ? psi[h] : 0);
  // the non-zero φ_{m+1} = phi[m] and θ_m = R[m], by index m
  const phiIdx: number[] = [];
  const thIdx: number[] = [];
  for (let i = 0; i < r; i++) {
    if (phi[i] !== 0) phiIdx.push(i);
    if (R[i] !== 0) thIdx.push(i);
  }
  const P = out && out.length === r * r ? out : new Float64Array(r * r);
  for (let i = 0; i < rows; i++) {
    for (let j = i; j < r; j++) {
      let s = 0;
      // φ_{i+k+1} = phi[m] with m = i + k, k = m − i ≥ 0
      for (const mi of phiIdx) {
        if (mi < i) continue;
        const k = mi - i;
        const a = phi[mi];
        for (const mj of phiIdx) {
          if (mj < j) continue;
          s += a * phi[mj] * gam(k - (mj - j));
        }
        for (const mj of thIdx) {
          if (mj < j) continue;
          s += a * R[mj] * ps(mj - j - 1 - k);
        }
      }
      for (const mi of thIdx) {
        if (mi < i) continue;
        const k = mi - i;
        const t = R[mi];
        for (const mj of phiIdx) {
          if (mj < j) continue;
          s += t * phi[mj] * ps(k - 1 - (mj - j));
        }
        // δ_kl: l = k, θ_{j+k}
        const mj = j + k;
        if (mj < r) s += t * R[mj];
      }
      P[i * r + j] = s;
      P[j * r + i] = s;
    }
  }
  return P;
}

/** Solve A x = b in place (b becomes x) by Gaussian elimination with partial pivoting; false if singular. */
function solveInPlace(A: Float64Array, b: Float64Array, m: number): boolean {
  for (let c = 0; c < m; c++) {
    let piv = c;
    let best = Math.abs(A[c * m + c]);
    for (let r = c + 1; r < m; r++) {
      const v = Math.abs(A[r * m + c]);
      if (v > best) {
        best = v;
        piv = r;
      }
    }
    if (!(best > 1e-300)) return false;
    if (piv !== c) {
      for (let k = 0; k < m; k++) {
        const t = A[c * m + k];
        A[c * m + k] = A[piv * m + k];
        A[piv * m + k] = t;
      }
      const t = b[c];
      b[c] = b[piv];
      b[piv] = t;
    }
    const d = A[c * m + c];
    for (let r = c + 1; r < m; r++) {
      const f = A[r * m + c] / d;
      if (f === 0) continue;
      for (let k = c; k < m; k++) A[r * m + k] -= f * A[c * m + k];
      b[r] -= f * b[c];
    }
  }
  for (let c = m - 1; c >= 0; c--) {
    let s = b[c];
    for (let k = c + 1; k < m; k++) s -= A[c * m + k] * b[k];
    b[c] = s / A[c * m + c];
  }
  return b.every(Number.isFinite);
}
