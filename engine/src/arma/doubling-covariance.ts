/**
 * The stationary state covariance P = Σ_k T^k R R' T'^k of a large ARMA state (seasonal blocks
 * at long periods) by the doubling algorithm (Anderson & Moore 1979, §6.7; Smith 1968):
 *   P_{j+1} = P_j + A_j P_j A_j',  A_{j+1} = A_j²,  from P_0 = R R', A_0 = T,
 * so that P_j holds the first 2^j terms of the series. It needs about log₂ of the number of
 * terms in O(r³) steps. The plain series costs O(r²) per term, and near a unit root (the search
 * of a seasonal AR block passes close to one) it ran to tens of thousands of terms: a fifth of a
 * second per likelihood evaluation at r = 28.
 */
export function doublingCovariance(r: number, phi: Float64Array, R: Float64Array, maxSteps = 40): Float64Array {
  let P = new Float64Array(r * r);
  for (let i = 0; i < r; i++) for (let j = 0; j < r; j++) P[i * r + j] = R[i] * R[j];
  // T: φ in the first column, ones on the superdiagonal
  let A = new Float64Array(r * r);
  for (let i = 0; i < r; i++) {
    A[i * r] = phi[i];
    if (i + 1 < r) A[i * r + i + 1] = 1;
  }
  let AP = new Float64Array(r * r);
  let next = new Float64Array(r * r);
  for (let step = 0; step < maxSteps; step++) {
    // AP = A P
    multiplyInto(A, P, AP, r);
    // next = P + AP A', and the trace of the added block
    let added = 0;
    let trace = 0;
    for (let i = 0; i < r; i++) {
      const ri = i * r;
      for (let j = 0; j < r; j++) {
        const rj = j * r;
        let s = 0;
        for (let k = 0; k < r; k++) s += AP[ri + k] * A[rj + k];
        next[ri + j] = P[ri + j] + s;
        if (i === j) {
          added += s;
          trace += next[ri + j];
        }
      }
    }
    [P, next] = [next, P];
    if (!(Math.abs(added) > 1e-16 * trace)) break;
    // A = A²
    multiplyInto(A, A, AP, r);
    [A, AP] = [AP, A];
  }
  return P;
}

/** out = a b, r×r row-major (out distinct from a and b), skipping a's zeros (T is mostly zeros). */
export function multiplyInto(a: Float64Array, b: Float64Array, out: Float64Array, r: number): void {
  out.fill(0);
  for (let i = 0; i < r; i++) {
    const ri = i * r;
    for (let k = 0; k < r; k++) {
      const v = a[ri + k];
      if (v === 0) continue;
      const rk = k * r;
      for (let j = 0; j < r; j++) out[ri + j] += v * b[rk + j];
    }
  }
}
