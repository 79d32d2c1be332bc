/**
 * The exact gradient of the fit's objective, ½ log(S/N) + ½ Σ log F_t / N with S = Σ v_t²/F_t
 * over the N observed hours (known mean), for a series with missing values. Without this the
 * search differenced the likelihood, k + 1 passes per gradient, and on the demand series with a
 * handful of missing hours the fits took 1.6–4.5 times as long as on the complete series.
 *
 * The forward pass is the Kalman filter in its textbook form with missing observations
 * (Durbin & Koopman 2012, §4.3 and §4.10; Z = e₀', no measurement noise, P in units of σ²):
 *   observed:  F = P₀₀, c = P e₀, v = y_t − a₀,  a ← a + c v/F,  P ← P − c c'/F;
 *   missing:   a and P unchanged;
 *   then       a ← T a,  P ← T P T' + R R',
 * from a = 0 and P the stationary covariance. As kalman.ts does, once an observed hour changes
 * the predicted P by less than tol the filter holds P (and so c and F) until the next missing
 * hour: O(r) an hour there, forward and back, and the gradient is that of the likelihood the
 * search sees. It stores c, F, v, the updated a₀ and whether P was held, for every hour (not
 * P); the backward pass (reverse-mode differentiation, Griewank & Walther 2008, ch. 3)
 * carries the adjoints ā of a and P̄ of P (kept symmetric) back to the start:
 *   predict:   φ̄ += ā a₀⁺ + 2 P̄ T c (the last term on missing hours only: after an observed
 *              hour P e₀ = 0), R̄ += 2 P̄ R, then ā ← T'ā, P̄ ← T' P̄ T;
 *   update:    v̄ = ∂J/∂v + ā·c/F,  c̄ = ā v/F − 2 P̄ c/F,  F̄ = ∂J/∂F − (ā·c) v/F² + c'P̄c/F²,
 *              ā₀ −= v̄,  P̄ += sym(c̄ e₀') + F̄ e₀e₀';
 *   held P:    the same without the covariance's terms (P̄ only gathers c̄ and F̄ of the hours
 *              that read the held P, and reaches the hour that computed it).
 * The adjoint left on the first P meets the stationary covariance's derivatives along each
 * coefficient (state-space.ts, Gardner's system), and φ̄, R̄ meet φ's and R's
 * (state-space-tangents.ts), by the chain rule; beyond that system's size (a seasonal block at
 * 24) the adjoint equation of the stationary covariance is solved instead (adjoint-lyapunov.ts).
 * O(r²) an hour where P moves, O(r) where it is held, whatever the number of coefficients.
 */
import { adjointLyapunov } from './adjoint-lyapunov';
import { stationaryCovariance, stationaryCovarianceFullTangents } from './state-space';
import { StateSpaceTangents } from './state-space-tangents';
import { backwardSmall, forwardSmall } from './gap-score-small';
import { scratch, scratchAtLeast } from './scratch';

export function gapScore(x: Float64Array, model: StateSpaceTangents, k: number, tol = 1e-10): Float64Array | null {
  const { ss, dPhi, dR } = model;
  const { r, phi, R } = ss;
  const n = x.length;
  if (n === 0) return null;
  // the stationary start with its derivatives (Gardner's system), or beyond its size the start
  // alone, its adjoint then carried to φ and R by adjointLyapunov
  const start = stationaryCovarianceFullTangents(ss, dPhi, dR, k);
  const P1 = start ? start.P : stationaryCovariance(ss);
  const small = r <= 4;
  const C = scratchAtLeast('gaps.c', n * (small ? 4 : r));
  const Fs = scratchAtLeast('gaps.f', n);
  const V = scratchAtLeast('gaps.v', n);
  const A0 = scratchAtLeast('gaps.a0', n);
  const Held = scratchAtLeast('gaps.held', n);
  const phib = scratch('gaps.phib', r);
  const PbR = scratch('gaps.PbR', r);
  let Pb: Float64Array;
  if (small) {
    // a state of at most 4 in scalars (gap-score-small.ts)
    const sums = scratch('gaps.sums', 2);
    if (!forwardSmall(x, phi, R, r, P1, tol, C, Fs, V, A0, Held, sums)) return null;
    const [S, N] = sums;
    if (!(S > 0) || N === 0) return null;
    Pb = scratch('gaps.Pb1', r * r);
    backwardSmall(n, phi, R, r, S, N, C, Fs, V, A0, Held, phib, PbR, Pb);
  } else {
    const sums = forwardPass(x, phi, R, r, P1, tol, C, Fs, V, A0, Held);
    if (!sums) return null;
    const { S, N } = sums;
    if (!(S > 0) || N === 0) return null;
    Pb = backwardPass(n, phi, R, r, S, N, C, Fs, V, A0, Held, phib, PbR);
  }
  if (!start) {
    // ⟨P̄₁, dP₁⟩ = ⟨X, dT P₁ T' + T P₁ dT' + dR R' + R dR'⟩ = 2 (X q)·dφ + 2 (X R)·dR, q = T P₁ e₀
    const X = adjointLyapunov(r, phi, Pb);
    if (!X) return null;
    for (let i = 0; i < r; i++) {
      let xq = 0;
      let xr = 0;
      for (let j = 0; j < r; j++) {
        const qj = phi[j] * P1[0] + (j + 1 < r ? P1[(j + 1) * r] : 0);
        xq += X[i * r + j] * qj;
        xr += X[i * r + j] * R[j];
      }
      phib[i] += 2 * xq;
      PbR[i] += xr;
    }
  }
  const grad = new Float64Array(k);
  for (let h = 0; h < k; h++) {
    const o = h * r;
    let g = 0;
    // R̄ = 2 Σ P̄ R
    for (let i = 0; i < r; i++) g += phib[i] * dPhi[o + i] + 2 * PbR[i] * dR[o + i];
    if (start) {
      const od = h * r * r;
      for (let i = 0; i < r * r; i++) g += Pb[i] * start.dP[od + i];
    }
    grad[h] = g;
  }
  return grad.every(Number.isFinite) ? grad : null;
}

/**
 * The filter, storing c, 1/F (0 where missing), v (NaN where missing), the updated a₀ and whether P was held (1) for
 * every hour; S and N, or null where F ≤ 0. The covariance step is fused as in kalman.ts's
 * riccatiStep: P ← T P T' + R R' − g g'/F with g = T c (the last term on observed hours only).
 */
function forwardPass(
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
): { S: number; N: number } | null {
  const n = x.length;
  let P = scratch('gaps.P', r * r);
  let Pn = scratch('gaps.Pn', r * r);
  P.set(P1);
  const a = scratch('gaps.a', r);
  const g = scratch('gaps.g', r + 1);
  let S = 0;
  let N = 0;
  let held = false;
  // the held P's first column and 1/F
  const ch = scratch('gaps.ch', r);
  let fh = 0;
  for (let t = 0; t < n; t++) {
    const y = x[t];
    const o = t * r;
    const observed = y === y;
    if (held && observed) {
      // P held: c and F as at the switch, only the state moves
      const v = y - a[0];
      const vf = v * fh;
      Fs[t] = fh;
      V[t] = v;
      S += v * vf;
      N++;
      const af0 = a[0] + ch[0] * vf;
      A0[t] = af0;
      Held[t] = 1;
      for (let i = 0; i < r; i++) {
        C[o + i] = ch[i];
        a[i] = phi[i] * af0 + (i + 1 < r ? a[i + 1] + ch[i + 1] * vf : 0);
      }
      continue;
    }
    for (let i = 0; i < r; i++) C[o + i] = P[i * r];
    let ginv = 0;
    if (observed) {
      const F = P[0];
      if (!(F > 0)) return null;
      ginv = 1 / F;
      const v = y - a[0];
      Fs[t] = ginv;
      V[t] = v;
      S += v * v * ginv;
      N++;
      const vf = v * ginv;
      for (let i = 0; i < r; i++) a[i] += C[o + i] * vf;
    } else {
      Fs[t] = 0;
      V[t] = NaN;
    }
    A0[t] = a[0];
    Held[t] = 0;
    // a ← T a
    const a0 = a[0];
    for (let i = 0; i < r - 1; i++) a[i] = phi[i] * a0 + a[i + 1];
    a[r - 1] = phi[r - 1] * a0;
    // (T P T')_ij = φ_i φ_j P₀₀ + φ_i P₀,ⱼ₊₁ + φ_j Pᵢ₊₁,₀ + Pᵢ₊₁,ⱼ₊₁; g_i = (T P e₀)_i = φ_i P₀₀ + Pᵢ₊₁,₀
    const p00 = P[0];
    for (let i = 0; i < r; i++) g[i] = phi[i] * p00 + (i + 1 < r ? P[(i + 1) * r] : 0);
    let change = 0;
    for (let i = 0; i < r; i++) {
      const pi = phi[i];
      const gi = g[i] * ginv;
      const below = i + 1 < r;
      for (let j = i; j < r; j++) {
        let v = pi * g[j] + R[i] * R[j] - gi * g[j];
        if (below) {
          v += phi[j] * P[(i + 1) * r];
          if (j + 1 < r) v += P[(i + 1) * r + j + 1];
        }
        Pn[i * r + j] = v;
        Pn[j * r + i] = v;
        const d = v - P[i * r + j];
        if (d > change) change = d;
        else if (-d > change) change = -d;
      }
    }
    const tmp = P;
    P = Pn;
    Pn = tmp;
    held = observed && change < tol;
    if (held) {
      for (let i = 0; i < r; i++) ch[i] = P[i * r];
      fh = 1 / P[0];
    }
  }
  return { S, N };
}

/** The backward pass: φ̄ into phib, Σ P̄ R over the covariance steps into PbR; returns P̄ at the first hour. */
function backwardPass(
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
): Float64Array {
  // adjoints of a_{t+1} and P_{t+1}; nothing after the last hour depends on them
  const ab = scratch('gaps.ab', r);
  const Pb = scratch('gaps.Pb', r * r);
  const u = scratch('gaps.u', r);
  const Pc = scratch('gaps.Pc', r);
  const invS = 1 / S;
  const invN = 1 / N;
  for (let t = n - 1; t >= 0; t--) {
    const o = t * r;
    const missing = V[t] !== V[t];
    const held = Held[t] === 1;
    // a_{t+1} = T a⁺: φ̄ += ā a⁺₀, then ā⁺ = T'ā ((T'z)₀ = Σ φ_k z_k, (T'z)_i = z_{i−1})
    const a0 = A0[t];
    let s0 = 0;
    for (let i = 0; i < r; i++) {
      phib[i] += ab[i] * a0;
      s0 += phi[i] * ab[i];
    }
    for (let i = r - 1; i >= 1; i--) ab[i] = ab[i - 1];
    ab[0] = s0;
    if (!held) {
      // P_{t+1} = T P⁺ T' + R R'
      if (missing) {
        // φ̄ += 2 P̄ g with g = T P⁺ e₀ = T c (after an observed hour P⁺ e₀ = 0)
        const c0 = C[o];
        for (let i = 0; i < r; i++) {
          const gi = phi[i] * c0 + (i + 1 < r ? C[o + i + 1] : 0);
          for (let j = 0; j < r; j++) phib[j] += 2 * Pb[j * r + i] * gi;
        }
      }
      // P̄⁺ = T' P̄ T, by T's shape: with u = P̄ φ, (T'P̄T)₀₀ = φ'u, (T'P̄T)₀ⱼ = u_{j−1} and
      // (T'P̄T)ᵢⱼ = P̄ᵢ₋₁,ⱼ₋₁ (P̄ symmetric); Σ P̄ R for R̄ on the way
      let uu = 0;
      for (let i = 0; i < r; i++) {
        let ui = 0;
        let ri = 0;
        for (let j = 0; j < r; j++) {
          ui += Pb[i * r + j] * phi[j];
          ri += Pb[i * r + j] * R[j];
        }
        u[i] = ui;
        PbR[i] += ri;
        uu += phi[i] * ui;
      }
      for (let i = r - 1; i >= 1; i--) {
        for (let j = r - 1; j >= 1; j--) Pb[i * r + j] = Pb[(i - 1) * r + j - 1];
        Pb[i * r] = u[i - 1];
      }
      // row 0 last: the shift above reads it
      for (let j = 1; j < r; j++) Pb[j] = u[j - 1];
      Pb[0] = uu;
    }
    if (missing) continue;
    // update: a⁺ = a + c v/F, P⁺ = P − c c'/F (not where P is held), v = y − a₀, F = P₀₀, c = P e₀
    // (divisions by F, S and N as products with their inverses: the held hours are a handful
    // of operations each, and a division costs several of them)
    const fi = Fs[t];
    const vf = V[t] * fi;
    let ac = 0;
    for (let i = 0; i < r; i++) ac += ab[i] * C[o + i];
    let Fb = 0.5 * fi * invN - 0.5 * vf * vf * invS - ac * vf * fi;
    if (held) {
      Pb[0] += ab[0] * vf;
      for (let i = 1; i < r; i++) {
        const half = 0.5 * ab[i] * vf;
        Pb[i * r] += half;
        Pb[i] += half;
      }
    } else {
      let cPc = 0;
      for (let i = 0; i < r; i++) {
        let s = 0;
        for (let j = 0; j < r; j++) s += Pb[i * r + j] * C[o + j];
        Pc[i] = s;
        cPc += C[o + i] * s;
      }
      Fb += cPc * fi * fi;
      for (let i = 0; i < r; i++) {
        const cb = ab[i] * vf - 2 * Pc[i] * fi;
        Pb[i * r] += 0.5 * cb;
        Pb[i] += 0.5 * cb;
      }
    }
    Pb[0] += Fb;
    ab[0] -= vf * invS + ac * fi;
  }
  return Pb;
}

