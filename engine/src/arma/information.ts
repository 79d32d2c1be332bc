/**
 * The asymptotic information matrix of a (seasonal) ARMA model per observation, in units of σ²
 * (Box & Jenkins 1970, §7.2.6; Brockwell & Davis 1991, §8.8). For
 * φ(B)Φ(B^s) w_t = θ(B)Θ(B^s) ε_t the derivative of the innovation with respect to a
 * coefficient is the innovation passed through the inverse of its own polynomial and lagged:
 *   ∂ε_t/∂φ_i = −B^i φ(B)^{-1} ε_t,   ∂ε_t/∂θ_i = −B^i θ(B)^{-1} ε_t,
 * and the same with B^s for the seasonal ones. The information is the covariance of those
 * derivative processes over σ², which follows from their impulse responses. It is also the
 * limit of the Hessian of the concentrated objective ½ log σ̂² + ½ Σ log F_t / n that the fit
 * minimises, so it serves as the starting Hessian of the quasi-Newton search: the search then
 * begins with a Newton-like step instead of a steepest-descent one.
 */
import type { ArmaSpec } from './fit';

export interface NaturalCoefficients {
  ar: Float64Array;
  ma: Float64Array;
  sar: Float64Array;
  sma: Float64Array;
}

/**
 * Impulse response of 1 / (1 − Σ c_i B^{i·step}) (sign −1 turns it into 1 / (1 + Σ c_i B^{i·step})),
 * and how much of it is not negligible: once a whole memory of the recursion (c.length·step
 * values) is below 1e-15, every later value is a decaying combination of those (the
 * polynomial is stationary), negligible beside h₀ = 1, so they are left at zero.
 */
function inverseResponse(c: Float64Array, step: number, sign: number, length: number): { h: Float64Array; used: number } {
  const h = new Float64Array(length);
  h[0] = 1;
  const memory = c.length * step;
  let quiet = 0;
  for (let k = step; k < length; k += step) {
    let v = 0;
    for (let i = 1; i <= c.length && i * step <= k; i++) v += c[i - 1] * h[k - i * step];
    h[k] = sign * v;
    quiet = Math.abs(v) < 1e-15 ? quiet + step : 0;
    if (quiet >= memory) return { h, used: k + 1 };
  }
  return { h, used: length };
}

/**
 * The information matrix in the natural coefficients, order ar, ma, sar, sma (row-major,
 * k×k). `length` truncates the impulse responses; the matrix is a starting Hessian, so a
 * truncation near a unit root costs accuracy there and nothing else.
 */
export function armaInformation(c: NaturalCoefficients, spec: Required<ArmaSpec>, length: number): Float64Array {
  const s = spec.period || 1;
  const blocks: Array<{ h: Float64Array; used: number; lag: number }> = [];
  const add = (coef: Float64Array, step: number, sign: number) => {
    if (coef.length === 0) return;
    const { h, used } = inverseResponse(coef, step, sign, length);
    for (let i = 1; i <= coef.length; i++) blocks.push({ h, used, lag: i * step });
  };
  add(c.ar, 1, 1);
  add(c.ma, 1, -1);
  add(c.sar, s, 1);
  add(c.sma, s, -1);
  const k = blocks.length;
  const info = new Float64Array(k * k);
  for (let a = 0; a < k; a++) {
    for (let b = a; b < k; b++) {
      // E[∂ε_a ∂ε_b] = Σ_m h_a[m − lag_a] h_b[m − lag_b]: with d = lag_b − lag_a ≥ 0 or < 0
      const { h: ha, used: ua, lag: la } = blocks[a];
      const { h: hb, used: ub, lag: lb } = blocks[b];
      const d = lb - la;
      let sum = 0;
      // beyond `used` a response is zero, so the products are too
      if (d >= 0) for (let j = 0, end = Math.min(length - d, ua - d, ub); j < end; j++) sum += ha[j + d] * hb[j];
      else for (let j = 0, end = Math.min(length + d, ua, ub + d); j < end; j++) sum += ha[j] * hb[j - d];
      info[a * k + b] = sum;
      info[b * k + a] = sum;
    }
  }
  return info;
}

/**
 * Inverse of a small symmetric positive definite matrix by Cholesky factorisation, with a ridge
 * of `ridge` times the mean diagonal added first (an overparameterised model, whose AR and MA
 * roots nearly cancel, has a nearly singular information). Null when it still is not positive
 * definite.
 */
export function inverseSpd(A: Float64Array, k: number, ridge = 1e-8): Float64Array | null {
  let trace = 0;
  for (let i = 0; i < k; i++) trace += A[i * k + i];
  const add = (ridge * trace) / Math.max(k, 1);
  const L = new Float64Array(k * k);
  for (let i = 0; i < k; i++) {
    for (let j = 0; j <= i; j++) {
      let v = A[i * k + j] + (i === j ? add : 0);
      for (let m = 0; m < j; m++) v -= L[i * k + m] * L[j * k + m];
      if (i === j) {
        if (!(v > 0)) return null;
        L[i * k + i] = Math.sqrt(v);
      } else L[i * k + j] = v / L[j * k + j];
    }
  }
  // inverse of L, then A⁻¹ = L⁻ᵀ L⁻¹
  const Li = new Float64Array(k * k);
  for (let i = 0; i < k; i++) {
    Li[i * k + i] = 1 / L[i * k + i];
    for (let j = 0; j < i; j++) {
      let v = 0;
      for (let m = j; m < i; m++) v -= L[i * k + m] * Li[m * k + j];
      Li[i * k + j] = v / L[i * k + i];
    }
  }
  const inv = new Float64Array(k * k);
  for (let i = 0; i < k; i++) {
    for (let j = 0; j <= i; j++) {
      let v = 0;
      for (let m = i; m < k; m++) v += Li[m * k + i] * Li[m * k + j];
      inv[i * k + j] = v;
      inv[j * k + i] = v;
    }
  }
  return inv;
}
