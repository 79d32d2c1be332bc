/**
 * Brings the low-rank deviation D = W M W' of steady-gap.ts down to its numerical rank.
 *
 * Each missing hour adds a rank to D, but the directions it adds are not independent: on an
 * hourly series with a seasonal block at 24, missing hours at the same hour of the day (the
 * same hour a day, a week or several weeks apart, which the seasonal differences of one missing
 * reading produce) add directions that the seasonal dynamics carry onto one another. On the
 * doubly differenced demand series with 28 missing values the eigenvalues of D (against the
 * dense filter's P_gaps − P_gapless) fall off to below 1e-14 of F after 5–7 of them, while the
 * count of missing hours, which is all the deviation's rank tracked, reaches 26.
 *
 * The reduction is the usual one for a symmetric low-rank product (Golub & Van Loan 2013,
 * §5.2.2 and §8.5): W = Q U by Householder QR (Q's first g columns orthonormal), the g × g
 * matrix S = U M U' = V Λ V' by the cyclic Jacobi method, then D = (Q V) Λ (Q V)', keeping the
 * eigenvalues with |λ| above `drop`. The directions left out change every element of P by at
 * most their |λ| summed, which the caller keeps far below the filter's own tolerance for
 * calling P steady: the same filter, to round-off. In scratch arrays: a fit runs it a few
 * times a pass, and a general matrix library's allocations cost more than the arithmetic here.
 */
import { scratchAtLeast } from './scratch';

/** Jacobi sweeps at most; at these sizes (g ≤ 16) it converges in 5–8. */
const MAX_SWEEPS = 40;

/**
 * Replaces the g columns of W (stride s, column-major, element r of each column left at zero)
 * and M (row-major, stride ms) by the columns and eigenvalues of the reduced form, M then
 * diagonal. Returns the new rank (≤ g).
 */
export function reduceDeviationRank(W: Float64Array, M: Float64Array, r: number, s: number, g: number, ms: number, drop: number): number {
  if (g === 0) return 0;
  // a deviation that is no longer finite is left as it is, so that the likelihood it feeds is not
  // finite either and the search rejects the point (dropping its directions would hide it)
  for (let j = 0; j < g; j++) {
    for (let i = 0; i < r; i++) if (!Number.isFinite(W[j * s + i])) return g;
    for (let l = 0; l < g; l++) if (!Number.isFinite(M[j * ms + l])) return g;
  }
  // W's columns into A (column-major, stride r), then Householder QR in place: the reflector of
  // column j is A[j..r−1, j] with beta[j], U's diagonal in d, its upper part above A's diagonal
  const A = scratchAtLeast('rank.A', r * g);
  const beta = scratchAtLeast('rank.beta', g);
  const d = scratchAtLeast('rank.d', g);
  for (let j = 0; j < g; j++) for (let i = 0; i < r; i++) A[j * r + i] = W[j * s + i];
  householderQr(A, r, g, beta, d);
  // U (g × g, row-major), then S = U M U'
  const U = scratchAtLeast('rank.U', g * g);
  for (let i = 0; i < g; i++) for (let j = 0; j < g; j++) U[i * g + j] = j < i ? 0 : j === i ? d[i] : A[j * r + i];
  const UM = scratchAtLeast('rank.UM', g * g);
  for (let i = 0; i < g; i++) {
    for (let l = 0; l < g; l++) {
      let sum = 0;
      for (let k = i; k < g; k++) sum += U[i * g + k] * 0.5 * (M[k * ms + l] + M[l * ms + k]);
      UM[i * g + l] = sum;
    }
  }
  const S = scratchAtLeast('rank.S', g * g);
  for (let i = 0; i < g; i++) {
    for (let j = i; j < g; j++) {
      let sum = 0;
      for (let l = j; l < g; l++) sum += UM[i * g + l] * U[j * g + l];
      S[i * g + j] = sum;
    }
  }
  for (let i = 0; i < g; i++) for (let j = 0; j < i; j++) S[i * g + j] = S[j * g + i];
  const V = scratchAtLeast('rank.V', g * g);
  jacobiEigen(S, V, g);
  // the kept directions, Q [V_l; 0], by the reflectors in reverse order
  let kept = 0;
  const lambda = scratchAtLeast('rank.lambda', g);
  for (let l = 0; l < g; l++) {
    const lam = S[l * g + l];
    if (!(Math.abs(lam) > drop)) continue;
    const o = kept * s;
    for (let i = 0; i < r; i++) W[o + i] = i < g ? V[i * g + l] : 0;
    for (let j = g - 1; j >= 0; j--) {
      const b = beta[j];
      if (b === 0) continue;
      let dot = 0;
      for (let i = j; i < r; i++) dot += A[j * r + i] * W[o + i];
      const f = b * dot;
      for (let i = j; i < r; i++) W[o + i] -= f * A[j * r + i];
    }
    W[o + r] = 0;
    lambda[kept] = lam;
    kept++;
  }
  for (let i = 0; i < kept; i++) {
    for (let j = 0; j < kept; j++) M[i * ms + j] = i === j ? lambda[i] : 0;
  }
  return kept;
}

/**
 * Householder QR of the r × g matrix A (column-major, stride r, r ≥ g) in place: H_j = I − β_j v_j v_j'
 * with v_j = A[j..r−1, j], U's diagonal in d and its strict upper part left in A above the diagonal.
 */
function householderQr(A: Float64Array, r: number, g: number, beta: Float64Array, d: Float64Array): void {
  for (let j = 0; j < g; j++) {
    const o = j * r;
    let norm2 = 0;
    for (let i = j; i < r; i++) norm2 += A[o + i] * A[o + i];
    const x0 = A[o + j];
    if (norm2 === 0) {
      beta[j] = 0;
      d[j] = 0;
      continue;
    }
    const norm = Math.sqrt(norm2);
    const alpha = x0 > 0 ? -norm : norm;
    A[o + j] = x0 - alpha;
    // v'v = norm² − 2 α x₀ + α² = 2 (norm² − α x₀)
    beta[j] = 1 / (norm2 - alpha * x0);
    d[j] = alpha;
    for (let c = j + 1; c < g; c++) {
      const oc = c * r;
      let dot = 0;
      for (let i = j; i < r; i++) dot += A[o + i] * A[oc + i];
      const f = beta[j] * dot;
      for (let i = j; i < r; i++) A[oc + i] -= f * A[o + i];
    }
  }
}

/**
 * The cyclic Jacobi method for the symmetric g × g matrix S (row-major): S ends diagonal with
 * the eigenvalues, V (row-major) holds the eigenvectors as columns.
 */
function jacobiEigen(S: Float64Array, V: Float64Array, g: number): void {
  for (let i = 0; i < g; i++) for (let j = 0; j < g; j++) V[i * g + j] = i === j ? 1 : 0;
  let total = 0;
  for (let i = 0; i < g * g; i++) total += S[i] * S[i];
  if (total === 0) return;
  for (let sweep = 0; sweep < MAX_SWEEPS; sweep++) {
    let off = 0;
    for (let i = 0; i < g; i++) for (let j = i + 1; j < g; j++) off += S[i * g + j] * S[i * g + j];
    if (off <= 1e-32 * total) return;
    for (let p = 0; p < g - 1; p++) {
      for (let q = p + 1; q < g; q++) {
        const spq = S[p * g + q];
        if (spq === 0) continue;
        // the rotation that zeroes S_pq (Golub & Van Loan, Algorithm 8.5.1)
        const tau = (S[q * g + q] - S[p * g + p]) / (2 * spq);
        const t = (tau >= 0 ? 1 : -1) / (Math.abs(tau) + Math.sqrt(1 + tau * tau));
        const c = 1 / Math.sqrt(1 + t * t);
        const sn = t * c;
        for (let k = 0; k < g; k++) {
          const skp = S[k * g + p];
          const skq = S[k * g + q];
          S[k * g + p] = c * skp - sn * skq;
          S[k * g + q] = sn * skp + c * skq;
        }
        for (let k = 0; k < g; k++) {
          const spk = S[p * g + k];
          const sqk = S[q * g + k];
          S[p * g + k] = c * spk - sn * sqk;
          S[q * g + k] = sn * spk + c * sqk;
        }
        for (let k = 0; k < g; k++) {
          const vkp = V[k * g + p];
          const vkq = V[k * g + q];
          V[k * g + p] = c * vkp - sn * vkq;
          V[k * g + q] = sn * vkp + c * vkq;
        }
      }
    }
  }
}
