/**
 * Reparametrisation that keeps an AR polynomial stationary (and, applied to −θ, an MA
 * polynomial invertible): unconstrained x ↦ partial autocorrelations u = tanh(x) ∈ (−1, 1) ↦
 * coefficients by the Durbin–Levinson recursion (Barndorff-Nielsen & Schou 1973; Jones 1980;
 * Monahan 1984). Every real vector maps to a stationary polynomial and back.
 */

/** Partial autocorrelations u (|u|<1) to AR coefficients φ (1 − Σ φ B^k). */
export function pacfToAr(u: ArrayLike<number>): Float64Array {
  const p = u.length;
  const phi = new Float64Array(p);
  const work = new Float64Array(p);
  for (let k = 0; k < p; k++) {
    const a = u[k];
    for (let j = 0; j < k; j++) work[j] = phi[j] - a * phi[k - 1 - j];
    for (let j = 0; j < k; j++) phi[j] = work[j];
    phi[k] = a;
  }
  return phi;
}

/**
 * AR coefficients to partial autocorrelations (the step-down recursion). Returns null when the
 * polynomial is not stationary (some |u| ≥ 1).
 */
export function arToPacf(phi: ArrayLike<number>): Float64Array | null {
  const p = phi.length;
  let cur = Float64Array.from(phi);
  const u = new Float64Array(p);
  for (let k = p - 1; k >= 0; k--) {
    const a = cur[k];
    if (!(Math.abs(a) < 1)) return null;
    u[k] = a;
    const next = new Float64Array(k);
    const d = 1 - a * a;
    for (let j = 0; j < k; j++) next[j] = (cur[j] + a * cur[k - 1 - j]) / d;
    cur = next;
  }
  return u;
}

/** Unconstrained values to stationary AR coefficients. */
export function toStationary(x: ArrayLike<number>): Float64Array {
  const u = new Float64Array(x.length);
  for (let i = 0; i < x.length; i++) u[i] = Math.tanh(x[i]);
  return pacfToAr(u);
}

/** Stationary AR coefficients to unconstrained values; null when not stationary. */
export function fromStationary(phi: ArrayLike<number>): Float64Array | null {
  const u = arToPacf(phi);
  if (!u) return null;
  const x = new Float64Array(u.length);
  for (let i = 0; i < u.length; i++) x[i] = Math.atanh(u[i]);
  return x;
}

/** Unconstrained values to invertible MA coefficients θ (1 + Σ θ B^k). */
export function toInvertible(x: ArrayLike<number>): Float64Array {
  const phi = toStationary(x);
  for (let i = 0; i < phi.length; i++) phi[i] = -phi[i];
  return phi;
}

export function fromInvertible(theta: ArrayLike<number>): Float64Array | null {
  const neg = new Float64Array(theta.length);
  for (let i = 0; i < theta.length; i++) neg[i] = -theta[i];
  return fromStationary(neg);
}

export function isStationary(phi: ArrayLike<number>): boolean {
  return arToPacf(phi) !== null;
}

export function isInvertible(theta: ArrayLike<number>): boolean {
  return fromInvertible(theta) !== null;
}

/**
 * toStationary and its Jacobian, jac[j·p + i] = ∂φ_i/∂x_j, by forward-mode differentiation of
 * the Durbin–Levinson recursion: φ_i ← φ_i − a_k φ_{k−1−i} gives
 * dφ_i ← dφ_i − da_k φ_{k−1−i} − a_k dφ_{k−1−i}, with da_k = 1 − tanh²(x_k) along x_k only.
 */
export function toStationaryJacobian(x: ArrayLike<number>): { phi: Float64Array; jac: Float64Array } {
  const p = x.length;
  const phi = new Float64Array(p);
  const work = new Float64Array(p);
  const jac = new Float64Array(p * p);
  for (let k = 0; k < p; k++) {
    const a = Math.tanh(x[k]);
    const da = 1 - a * a;
    // tangents first: they need φ before this step
    for (let j = 0; j <= k; j++) {
      const row = j * p;
      for (let i = 0; i < k; i++) work[i] = jac[row + i] - (j === k ? da * phi[k - 1 - i] : 0) - a * jac[row + k - 1 - i];
      for (let i = 0; i < k; i++) jac[row + i] = work[i];
      jac[row + k] = j === k ? da : 0;
    }
    for (let i = 0; i < k; i++) work[i] = phi[i] - a * phi[k - 1 - i];
    for (let i = 0; i < k; i++) phi[i] = work[i];
    phi[k] = a;
  }
  return { phi, jac };
}

/**
 * toStationary (sign 1) or toInvertible (sign −1) of x[from..from+p) written into out[0..p),
 * with work (length ≥ p) as scratch: the same recursion without allocating, for the likelihood
 * objective, which maps a vector hundreds of times per fit.
 */
export function toStationaryInto(x: ArrayLike<number>, from: number, p: number, out: Float64Array, work: Float64Array, sign: number): void {
  for (let k = 0; k < p; k++) {
    const a = Math.tanh(x[from + k]);
    for (let j = 0; j < k; j++) work[j] = out[j] - a * out[k - 1 - j];
    for (let j = 0; j < k; j++) out[j] = work[j];
    out[k] = a;
  }
  if (sign < 0) for (let k = 0; k < p; k++) out[k] = -out[k];
}
