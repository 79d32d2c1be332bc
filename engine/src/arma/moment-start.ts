/**
 * Starting values for the two smallest mixed and moving-average orders, MA(1) and ARMA(1,1),
 * by the method of moments (Box & Jenkins 1970, §6.3.2 and §6.3.3): the first one or two
 * sample autocorrelations are matched to the model's.
 *   MA(1):      ρ₁ = θ / (1 + θ²), the invertible root θ = (1 − √(1 − 4ρ₁²)) / (2ρ₁);
 *   ARMA(1,1):  φ = ρ₂ / ρ₁, and ρ₁ = (1 + φθ)(φ + θ) / (1 + 2φθ + θ²), that is
 *               (φ − ρ₁) θ² + (1 + φ² − 2φρ₁) θ + (φ − ρ₁) = 0, whose two roots multiply to 1:
 *               the invertible one is kept.
 * Two autocorrelations cost a hundredth of the Hannan–Rissanen regression (a long autoregression
 * and its residuals), which was a third to a half of the whole exact-ML fit of these orders on
 * 2,000 hours of differenced load. The estimates are less efficient than Hannan–Rissanen's, but
 * they are only where the exact-likelihood search begins: these orders have one interior maximum
 * on the demand series and on R's real series (checked by real-series.spec.ts and the bench).
 * Where the sample autocorrelations admit no model of the order (|ρ₁| ≥ ½ for MA(1), no real
 * root for ARMA(1,1)), the start is put just inside the region on the side the data lean to.
 */
import { autocovariance } from '../series/acf';

export interface MomentStart {
  ar: Float64Array;
  ma: Float64Array;
}

/** Where a start that the moments put on or beyond the unit circle is placed instead. */
const EDGE = 0.95;

/** Whether the moment start covers this order (non-seasonal MA(1) and ARMA(1,1)). */
export function hasMomentStart(p: number, q: number, P: number, Q: number): boolean {
  return P === 0 && Q === 0 && q === 1 && p <= 1;
}

/** The moment estimates for MA(1) (p = 0) or ARMA(1,1) (p = 1) of a centred series; null when undefined. */
export function momentStart(x: ArrayLike<number>, p: 0 | 1): MomentStart | null {
  const g = autocovariance(x, 2);
  if (!(g[0] > 0)) return null;
  const r1 = g[1] / g[0];
  const r2 = g[2] / g[0];
  if (!Number.isFinite(r1) || !Number.isFinite(r2)) return null;
  if (p === 0) return { ar: new Float64Array(0), ma: Float64Array.of(invertibleMa1(r1)) };
  // φ = ρ₂/ρ₁ is noise over noise when ρ₁ is within the white-noise band ±2/√n (Bartlett 1946);
  // the AR and MA parts then nearly cancel, and the search starts from neither
  if (Math.abs(r1) < 2 / Math.sqrt(x.length)) return { ar: Float64Array.of(0), ma: Float64Array.of(0) };
  const phi = clampInside(r2 / r1);
  const a = phi - r1;
  const b = 1 + phi * phi - 2 * phi * r1;
  let theta: number;
  if (Math.abs(a) < 1e-12) theta = 0;
  else {
    const disc = b * b - 4 * a * a;
    // no real root: the closest the order comes is the unit circle, on the side −b/(2a) points to
    theta = disc >= 0 ? (-b + Math.sqrt(disc)) / (2 * a) : -Math.sign(a) * EDGE;
  }
  return { ar: Float64Array.of(phi), ma: Float64Array.of(clampInside(theta)) };
}

function invertibleMa1(r1: number): number {
  if (Math.abs(r1) < 1e-12) return 0;
  if (!(Math.abs(r1) < 0.5)) return Math.sign(r1) * EDGE;
  return clampInside((1 - Math.sqrt(1 - 4 * r1 * r1)) / (2 * r1));
}

function clampInside(v: number): number {
  return Math.abs(v) < EDGE ? v : Math.sign(v) * EDGE;
}
