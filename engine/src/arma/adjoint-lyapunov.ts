import { multiplyInto } from './doubling-covariance';

/**
 * X = Σ_k (T')^k B T^k, the solution of X − T' X T = B, for T the ARMA state's transition (φ in
 * the first column, ones on the superdiagonal) and B symmetric, by the doubling algorithm
 * (Anderson & Moore 1979, §6.7; Smith 1968) as doubling-covariance.ts sums P, transposed:
 *   X_{j+1} = X_j + A_j' X_j A_j,  A_{j+1} = A_j²,  from X_0 = B, A_0 = T.
 * It is the adjoint of the stationary covariance's equation P − T P T' = R R': where a
 * likelihood's adjoint on P is B, its derivative along any direction in which T and R move is
 * ⟨X, dT P T' + T P dT' + dR R' + R dR'⟩ (gap-score.ts), one solve for every direction instead
 * of one per direction. Returns null where the terms do not die out within maxSteps doublings
 * (a unit root). Row-major r×r.
 */
export function adjointLyapunov(r: number, phi: Float64Array, B: Float64Array, maxSteps = 40): Float64Array | null {
  let X = Float64Array.from(B.subarray(0, r * r));
  let A = new Float64Array(r * r);
  for (let i = 0; i < r; i++) {
    A[i * r] = phi[i];
    if (i + 1 < r) A[i * r + i + 1] = 1;
  }
  let XA = new Float64Array(r * r);
  let next = new Float64Array(r * r);
  for (let step = 0; step < maxSteps; step++) {
    // XA = X A, then next = X + A' (X A)
    multiplyInto(X, A, XA, r);
    let added = 0;
    let size = 0;
    for (let i = 0; i < r; i++) {
      for (let j = 0; j < r; j++) {
        let s = 0;
        for (let k = 0; k < r; k++) s += A[k * r + i] * XA[k * r + j];
        const v = X[i * r + j] + s;
        next[i * r + j] = v;
        added = Math.max(added, Math.abs(s));
        size = Math.max(size, Math.abs(v));
      }
    }
    [X, next] = [next, X];
    if (!Number.isFinite(size)) return null;
    if (added <= 1e-15 * size) return X;
    // A ← A²
    multiplyInto(A, A, XA, r);
    [A, XA] = [XA, A];
  }
  return null;
}
