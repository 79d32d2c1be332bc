/**
 * The state-space form at a vector of unconstrained values u (order ar, ma, sar, sma, as the
 * fit searches them) and its derivatives with respect to each u_j: what the steady-state
 * score needs to carry derivatives from φ and R back to the search's coordinates. The chain
 * is the partial-autocorrelation transform (transform.ts, differentiated through its
 * Durbin–Levinson recursion), then the seasonal product (polynomials.ts, bilinear).
 */
import { expandAr, expandArTangent, expandMa, expandMaTangent } from './polynomials';
import { armaStateSpace, ArmaStateSpace } from './state-space';
import { toStationaryJacobian } from './transform';

export interface Orders {
  p: number;
  q: number;
  P: number;
  Q: number;
  /** seasonal period (0 or 1 without a seasonal block) */
  period: number;
}

export interface StateSpaceTangents {
  ss: ArmaStateSpace;
  /** ∂φ/∂u_j and ∂R/∂u_j, row-major k×r */
  dPhi: Float64Array;
  dR: Float64Array;
}

/**
 * With `naturalMa` the MA values of u are the coefficients themselves (θ of 1 + θ₁B + …, no
 * transform, so the MA part may leave the invertible region), as R's arima searches them; the AR
 * values go through the transform either way (see fit.ts, the natural-MA start).
 */
export function stateSpaceWithTangents(u: Float64Array, o: Orders, naturalMa = false): StateSpaceTangents {
  if (o.P + o.Q === 0) return nonSeasonal(u, o.p, o.q, naturalMa);
  const s = o.period || 1;
  const ar = toStationaryJacobian(u.subarray(0, o.p));
  const sar = toStationaryJacobian(u.subarray(o.p + o.q, o.p + o.q + o.P));
  const maPart = (from: number, m: number): { phi: Float64Array; jac: Float64Array } => {
    if (naturalMa) return { phi: Float64Array.from(u.subarray(from, from + m)), jac: identity(m) };
    // invertible MA coefficients are the negated stationary ones (transform.ts), derivatives too
    const t = toStationaryJacobian(u.subarray(from, from + m));
    for (let i = 0; i < t.phi.length; i++) t.phi[i] = -t.phi[i];
    for (let i = 0; i < t.jac.length; i++) t.jac[i] = -t.jac[i];
    return t;
  };
  const ma = maPart(o.p, o.q);
  const sma = maPart(o.p + o.q + o.P, o.Q);
  const theta = ma.phi;
  const stheta = sma.phi;
  const ss = armaStateSpace(expandAr(ar.phi, sar.phi, s), expandMa(theta, stheta, s));
  const r = ss.r;
  const k = o.p + o.q + o.P + o.Q;
  const dPhi = new Float64Array(k * r);
  const dR = new Float64Array(k * r);
  const row = (jac: Float64Array, m: number, a: number) => jac.subarray(a * m, (a + 1) * m);
  const zeros = new Float64Array(Math.max(o.p, o.q, o.P, o.Q));
  const none = (m: number) => zeros.subarray(0, m);
  let j = 0;
  for (let a = 0; a < o.p; a++, j++) dPhi.set(expandArTangent(ar.phi, sar.phi, row(ar.jac, o.p, a), none(o.P), s), j * r);
  for (let a = 0; a < o.q; a++, j++) dR.set(expandMaTangent(theta, stheta, row(ma.jac, o.q, a), none(o.Q), s), j * r + 1);
  for (let a = 0; a < o.P; a++, j++) dPhi.set(expandArTangent(ar.phi, sar.phi, none(o.p), row(sar.jac, o.P, a), s), j * r);
  for (let a = 0; a < o.Q; a++, j++) dR.set(expandMaTangent(theta, stheta, none(o.q), row(sma.jac, o.Q, a), s), j * r + 1);
  return { ss, dPhi, dR };
}

/** Without a seasonal block the polynomials are the coefficients themselves: φ, and R = (1, θ). */
function nonSeasonal(u: Float64Array, p: number, q: number, naturalMa: boolean): StateSpaceTangents {
  const ar = toStationaryJacobian(u.subarray(0, p));
  const r = Math.max(p, q + 1, 1);
  const phi = new Float64Array(r);
  const R = new Float64Array(r);
  phi.set(ar.phi);
  R[0] = 1;
  const k = p + q;
  const dPhi = new Float64Array(k * r);
  const dR = new Float64Array(k * r);
  for (let j = 0; j < p; j++) for (let i = 0; i < p; i++) dPhi[j * r + i] = ar.jac[j * p + i];
  if (naturalMa) {
    for (let i = 0; i < q; i++) {
      R[i + 1] = u[p + i];
      dR[(p + i) * r + i + 1] = 1;
    }
  } else {
    const ma = toStationaryJacobian(u.subarray(p, p + q));
    for (let i = 0; i < q; i++) R[i + 1] = -ma.phi[i];
    for (let j = 0; j < q; j++) for (let i = 0; i < q; i++) dR[(p + j) * r + i + 1] = -ma.jac[j * q + i];
  }
  return { ss: { r, phi, R }, dPhi, dR };
}

/** The m×m identity, row-major (the Jacobian of coefficients searched as they are). */
function identity(m: number): Float64Array {
  const out = new Float64Array(m * m);
  for (let i = 0; i < m; i++) out[i * m + i] = 1;
  return out;
}
