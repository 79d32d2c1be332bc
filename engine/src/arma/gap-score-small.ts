/**
 * gap-score.ts's forward and backward passes for a state of at most 4 (every non-seasonal
 * order p, q ≤ 3) with the state, P and their adjoints in scalars, zero beyond r: the same
 * recursions, without the loops over arrays that made an hour where P moves cost several times
 * the filter's own (kalman.ts). P is held as there once an observed hour changes it by less
 * than tol. c is stored with a stride of 4.
 *
 * Forward, per hour: F = P₀₀, v = y − a₀, a⁺ = a + c v/F (c = P e₀), a ← T a⁺, and where P
 * moves P ← T P T' + R R' − g g'/F with g = T c (the last term on observed hours only), written
 * out for the ten distinct elements of P: (T P T')ᵢⱼ = φᵢ gⱼ + φⱼ Pᵢ₊₁,₀ + Pᵢ₊₁,ⱼ₊₁.
 * Backward, per hour: the adjoints of gap-score.ts; T'P̄T by T's shape: with u = P̄ φ, its
 * first row is (φ'u, u₀, u₁, u₂) and the rest P̄ shifted down and right by one.
 */

/** The filter from P1 (r×r), storing what the backward pass reads; S and N into sums, false where F ≤ 0. */
export function forwardSmall(
  x: Float64Array,
  phi: Float64Array,
  R: Float64Array,
  r: number,
  P1: Float64Array,
  tol: number,
  C: Float64Array,
  Fs: Float64Array,
  V: Float64Array,
  A0: Float64Array,
  Held: Float64Array,
  sums: Float64Array,
): boolean {
  const n = x.length;
  const f0 = phi[0];
  const f1 = r > 1 ? phi[1] : 0;
  const f2 = r > 2 ? phi[2] : 0;
  const f3 = r > 3 ? phi[3] : 0;
  const R0 = R[0];
  const R1 = r > 1 ? R[1] : 0;
  const R2 = r > 2 ? R[2] : 0;
  const R3 = r > 3 ? R[3] : 0;
  const at = (i: number, j: number): number => (i < r && j < r ? P1[i * r + j] : 0);
  let p00 = at(0, 0);
  let p01 = at(0, 1);
  let p02 = at(0, 2);
  let p03 = at(0, 3);
  let p11 = at(1, 1);
  let p12 = at(1, 2);
  let p13 = at(1, 3);
  let p22 = at(2, 2);
  let p23 = at(2, 3);
  let p33 = at(3, 3);
  let a0 = 0;
  let a1 = 0;
  let a2 = 0;
  let a3 = 0;
  let S = 0;
  let N = 0;
  let held = false;
  let fh = 0;
  for (let t = 0; t < n; t++) {
    const y = x[t];
    const o = 4 * t;
    C[o] = p00;
    C[o + 1] = p01;
    C[o + 2] = p02;
    C[o + 3] = p03;
    const observed = y === y;
    if (held && observed) {
      const v = y - a0;
      const vf = v * fh;
      S += v * vf;
      N++;
      const af0 = a0 + p00 * vf;
      V[t] = v;
      Fs[t] = fh;
      A0[t] = af0;
      Held[t] = 1;
      a0 = f0 * af0 + a1 + p01 * vf;
      a1 = f1 * af0 + a2 + p02 * vf;
      a2 = f2 * af0 + a3 + p03 * vf;
      a3 = f3 * af0;
      continue;
    }
    let ginv = 0;
    let af0 = a0;
    let vf = 0;
    if (observed) {
      if (!(p00 > 0)) return false;
      ginv = 1 / p00;
      const v = y - a0;
      vf = v * ginv;
      S += v * vf;
      N++;
      af0 = a0 + p00 * vf;
      V[t] = v;
    } else V[t] = NaN;
    Fs[t] = ginv;
    A0[t] = af0;
    Held[t] = 0;
    a0 = f0 * af0 + a1 + p01 * vf;
    a1 = f1 * af0 + a2 + p02 * vf;
    a2 = f2 * af0 + a3 + p03 * vf;
    a3 = f3 * af0;
    // P ← T P T' + R R' − g g'/F
    const g0 = f0 * p00 + p01;
    const g1 = f1 * p00 + p02;
    const g2 = f2 * p00 + p03;
    const g3 = f3 * p00;
    const h0 = g0 * ginv;
    const h1 = g1 * ginv;
    const h2 = g2 * ginv;
    const h3 = g3 * ginv;
    const n00 = f0 * g0 + f0 * p01 + p11 + R0 * R0 - h0 * g0;
    const n01 = f0 * g1 + f1 * p01 + p12 + R0 * R1 - h0 * g1;
    const n02 = f0 * g2 + f2 * p01 + p13 + R0 * R2 - h0 * g2;
    const n03 = f0 * g3 + f3 * p01 + R0 * R3 - h0 * g3;
    const n11 = f1 * g1 + f1 * p02 + p22 + R1 * R1 - h1 * g1;
    const n12 = f1 * g2 + f2 * p02 + p23 + R1 * R2 - h1 * g2;
    const n13 = f1 * g3 + f3 * p02 + R1 * R3 - h1 * g3;
    const n22 = f2 * g2 + f2 * p03 + p33 + R2 * R2 - h2 * g2;
    const n23 = f2 * g3 + f3 * p03 + R2 * R3 - h2 * g3;
    const n33 = f3 * g3 + R3 * R3 - h3 * g3;
    const change = Math.max(
      Math.abs(n00 - p00),
      Math.abs(n01 - p01),
      Math.abs(n02 - p02),
      Math.abs(n03 - p03),
      Math.abs(n11 - p11),
      Math.abs(n12 - p12),
      Math.abs(n13 - p13),
      Math.abs(n22 - p22),
      Math.abs(n23 - p23),
      Math.abs(n33 - p33),
    );
    p00 = n00;
    p01 = n01;
    p02 = n02;
    p03 = n03;
    p11 = n11;
    p12 = n12;
    p13 = n13;
    p22 = n22;
    p23 = n23;
    p33 = n33;
    held = observed && change < tol;
    if (held) fh = 1 / p00;
  }
  sums[0] = S;
  sums[1] = N;
  return true;
}

/**
 * The backward pass over what forwardSmall stored: φ̄ into phib, Σ P̄ R into PbR, and P̄ at the
 * first hour into Pb (r×r), each of length r (r×r).
 */
export function backwardSmall(
  n: number,
  phi: Float64Array,
  R: Float64Array,
  r: number,
  S: number,
  N: number,
  C: Float64Array,
  Fs: Float64Array,
  V: Float64Array,
  A0: Float64Array,
  Held: Float64Array,
  phib: Float64Array,
  PbR: Float64Array,
  Pb: Float64Array,
): void {
  const f0 = phi[0];
  const f1 = r > 1 ? phi[1] : 0;
  const f2 = r > 2 ? phi[2] : 0;
  const f3 = r > 3 ? phi[3] : 0;
  const R0 = R[0];
  const R1 = r > 1 ? R[1] : 0;
  const R2 = r > 2 ? R[2] : 0;
  const R3 = r > 3 ? R[3] : 0;
  const invS = 1 / S;
  const invN = 1 / N;
  // P̄ (symmetric, ten elements), ā, and the sums φ̄ and Σ P̄ R
  let b00 = 0;
  let b01 = 0;
  let b02 = 0;
  let b03 = 0;
  let b11 = 0;
  let b12 = 0;
  let b13 = 0;
  let b22 = 0;
  let b23 = 0;
  let b33 = 0;
  let e0 = 0;
  let e1 = 0;
  let e2 = 0;
  let e3 = 0;
  let q0 = 0;
  let q1 = 0;
  let q2 = 0;
  let q3 = 0;
  let w0 = 0;
  let w1 = 0;
  let w2 = 0;
  let w3 = 0;
  for (let t = n - 1; t >= 0; t--) {
    const o = 4 * t;
    // a_{t+1} = T a⁺: φ̄ += ā a⁺₀, ā⁺ = T'ā
    const a0 = A0[t];
    q0 += e0 * a0;
    q1 += e1 * a0;
    q2 += e2 * a0;
    q3 += e3 * a0;
    const s0 = f0 * e0 + f1 * e1 + f2 * e2 + f3 * e3;
    e3 = e2;
    e2 = e1;
    e1 = e0;
    e0 = s0;
    const c0 = C[o];
    const c1 = C[o + 1];
    const c2 = C[o + 2];
    const c3 = C[o + 3];
    const fi = Fs[t];
    if (Held[t] === 1) {
      // P held: the update's terms only, on the held P
      const vf = V[t] * fi;
      const ac = e0 * c0 + e1 * c1 + e2 * c2 + e3 * c3;
      b00 += e0 * vf + 0.5 * fi * invN - 0.5 * vf * vf * invS - ac * vf * fi;
      b01 += 0.5 * e1 * vf;
      b02 += 0.5 * e2 * vf;
      b03 += 0.5 * e3 * vf;
      e0 -= vf * invS + ac * fi;
      continue;
    }
    const missing = V[t] !== V[t];
    if (missing) {
      // φ̄ += 2 P̄ g, g = T c
      const g0 = f0 * c0 + c1;
      const g1 = f1 * c0 + c2;
      const g2 = f2 * c0 + c3;
      const g3 = f3 * c0;
      q0 += 2 * (b00 * g0 + b01 * g1 + b02 * g2 + b03 * g3);
      q1 += 2 * (b01 * g0 + b11 * g1 + b12 * g2 + b13 * g3);
      q2 += 2 * (b02 * g0 + b12 * g1 + b22 * g2 + b23 * g3);
      q3 += 2 * (b03 * g0 + b13 * g1 + b23 * g2 + b33 * g3);
    }
    w0 += b00 * R0 + b01 * R1 + b02 * R2 + b03 * R3;
    w1 += b01 * R0 + b11 * R1 + b12 * R2 + b13 * R3;
    w2 += b02 * R0 + b12 * R1 + b22 * R2 + b23 * R3;
    w3 += b03 * R0 + b13 * R1 + b23 * R2 + b33 * R3;
    // P̄ ← T' P̄ T
    const u0 = b00 * f0 + b01 * f1 + b02 * f2 + b03 * f3;
    const u1 = b01 * f0 + b11 * f1 + b12 * f2 + b13 * f3;
    const u2 = b02 * f0 + b12 * f1 + b22 * f2 + b23 * f3;
    const u3 = b03 * f0 + b13 * f1 + b23 * f2 + b33 * f3;
    b33 = b22;
    b23 = b12;
    b22 = b11;
    b13 = b02;
    b12 = b01;
    b11 = b00;
    b03 = u2;
    b02 = u1;
    b01 = u0;
    b00 = f0 * u0 + f1 * u1 + f2 * u2 + f3 * u3;
    if (missing) continue;
    // the update: a⁺ = a + c v/F, P⁺ = P − c c'/F
    const vf = V[t] * fi;
    const ac = e0 * c0 + e1 * c1 + e2 * c2 + e3 * c3;
    const pc0 = b00 * c0 + b01 * c1 + b02 * c2 + b03 * c3;
    const pc1 = b01 * c0 + b11 * c1 + b12 * c2 + b13 * c3;
    const pc2 = b02 * c0 + b12 * c1 + b22 * c2 + b23 * c3;
    const pc3 = b03 * c0 + b13 * c1 + b23 * c2 + b33 * c3;
    const cPc = c0 * pc0 + c1 * pc1 + c2 * pc2 + c3 * pc3;
    const Fb = 0.5 * fi * invN - 0.5 * vf * vf * invS - ac * vf * fi + cPc * fi * fi;
    b00 += e0 * vf - 2 * pc0 * fi + Fb;
    b01 += 0.5 * (e1 * vf - 2 * pc1 * fi);
    b02 += 0.5 * (e2 * vf - 2 * pc2 * fi);
    b03 += 0.5 * (e3 * vf - 2 * pc3 * fi);
    e0 -= vf * invS + ac * fi;
  }
  const q = [q0, q1, q2, q3];
  const w = [w0, w1, w2, w3];
  const b = [b00, b01, b02, b03, b01, b11, b12, b13, b02, b12, b22, b23, b03, b13, b23, b33];
  for (let i = 0; i < r; i++) {
    phib[i] = q[i];
    PbR[i] = w[i];
    for (let j = 0; j < r; j++) Pb[i * r + j] = b[i * 4 + j];
  }
}
