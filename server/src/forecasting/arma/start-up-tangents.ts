/**
 * Forward-mode derivatives (tangents) of the Kalman filter's start-up stretch, hours 0..t₀ of a
 * complete series with the mean removed, along k directions in the coefficients at once: what
 * the steady-state score (steady-score.ts) joins to its backward pass. The recursions are the
 * filter's own Chandrasekhar form (kalman.ts; Morf, Sidhu & Kailath 1974) for the first row p
 * of P, the vector w and the scalar m, with the observation's exactness used twice
 * (a_{t|t,0} = y_t, and the first element of w − p (Z w)/F is zero):
 *   F = p₀, v = y − a₀,  S += v²/F,  L += log F,
 *   a_i ← φ_i y + a_{i+1} + p_{i+1} v/F,
 *   w_i ← w_{i+1} − p_{i+1} w₀/F,  p_i ← p_i + m w₀ w_i,  m ← m − m² w₀² / p₀(new),
 * and each tangent follows them by the product rule, started from the derivative of the
 * stationary covariance (state-space.ts). Exact, unlike differences, and one pass for all k.
 */
import { scratch } from './scratch';
import { ArmaStateSpace, stationaryCovarianceTangents } from './state-space';

export interface StartUpTangents {
  /** per direction: d(Σ v²/F), d(Σ log F) over hours 0..t₀ */
  ssq: Float64Array;
  sumLogF: Float64Array;
  /** per direction (row-major k×r): d a_{t₀+1}, d gain = d(p/p₀) */
  a: Float64Array;
  gain: Float64Array;
  /** per direction: d F = d p₀ after hour t₀ */
  F: Float64Array;
}

/**
 * Tangents of the start-up along the directions dPhi, dR (row-major k×r: the derivatives of
 * the state-space φ and R).
 */
export function startUpTangents(x: Float64Array, ss: ArmaStateSpace, dPhi: Float64Array, dR: Float64Array, k: number, t0: number): StartUpTangents {
  const { r, phi } = ss;
  const start = stationaryCovarianceTangents(ss, dPhi, dR, k);
  const s = r + 1;
  // base: padded to stride s, element r stays zero
  const p = scratch('tangents.p', s);
  let w = scratch('tangents.w', s);
  let wn = scratch('tangents.wn', s);
  const a = scratch('tangents.a', s);
  // tangents, one padded row per direction
  const dp = scratch('tangents.dp', k * s);
  let dw = scratch('tangents.dw', k * s);
  let dwn = scratch('tangents.dwn', k * s);
  const da = scratch('tangents.da', k * s);
  const dm = scratch('tangents.dm', k);
  const dS = new Float64Array(k);
  const dL = new Float64Array(k);
  const { row, dRow } = start;
  const p00 = row[0];
  for (let i = 0; i < r; i++) p[i] = row[i];
  for (let i = 0; i < r; i++) w[i] = phi[i] * p00 + p[i + 1];
  let m = -1 / p00;
  for (let j = 0; j < k; j++) {
    const o = j * s;
    const or = j * r;
    for (let i = 0; i < r; i++) dp[o + i] = dRow[or + i];
    const dp00 = dp[o];
    for (let i = 0; i < r; i++) dw[o + i] = dPhi[or + i] * p00 + phi[i] * dp00 + dp[o + i + 1];
    dm[j] = dp00 / (p00 * p00);
  }
  for (let t = 0; t <= t0; t++) {
    const y = x[t];
    const F = p[0];
    const ginv = 1 / F;
    const v = y - a[0];
    const vf = v * ginv;
    const zw = w[0];
    const coef = zw * ginv;
    const mz = m * zw;
    // the new p₀, needed by the update of m and of its tangents
    const p0n = p[0] + mz * w[0];
    for (let j = 0; j < k; j++) {
      const o = j * s;
      const or = j * r;
      const dF = dp[o];
      const dginv = -dF * ginv * ginv;
      const dv = -da[o];
      const dvf = dv * ginv + v * dginv;
      dS[j] += dv * vf + v * dvf;
      dL[j] += dF * ginv;
      const dzw = dw[o];
      const dcoef = dzw * ginv + zw * dginv;
      const dmz = dm[j] * zw + m * dzw;
      // one ascending loop: index i + 1 of a, p still holds the previous hour's value when
      // index i is updated
      for (let i = 0; i < r; i++) {
        const pi1 = p[i + 1];
        const dpi1 = dp[o + i + 1];
        da[o + i] = dPhi[or + i] * y + da[o + i + 1] + dpi1 * vf + pi1 * dvf;
        dwn[o + i] = dw[o + i + 1] - dpi1 * coef - pi1 * dcoef;
        dp[o + i] += dmz * w[i] + mz * dw[o + i];
      }
      // m ← m − m² w₀² / p₀(new)
      const dp0n = dp[o];
      dm[j] += (-2 * mz * dmz) / p0n + (mz * mz * dp0n) / (p0n * p0n);
    }
    for (let i = 0; i < r; i++) {
      const pi1 = p[i + 1];
      a[i] = phi[i] * y + a[i + 1] + pi1 * vf;
      wn[i] = w[i + 1] - pi1 * coef;
      p[i] += mz * w[i];
    }
    m -= (mz * mz) / p0n;
    const tw = w;
    w = wn;
    wn = tw;
    const tdw = dw;
    dw = dwn;
    dwn = tdw;
  }
  const F = p[0];
  const aOut = new Float64Array(k * r);
  const gain = new Float64Array(k * r);
  const dF = new Float64Array(k);
  for (let j = 0; j < k; j++) {
    const o = j * s;
    const dp0 = dp[o];
    dF[j] = dp0;
    for (let i = 0; i < r; i++) {
      aOut[j * r + i] = da[o + i];
      gain[j * r + i] = dp[o + i] / F - (p[i] * dp0) / (F * F);
    }
  }
  return { ssq: dS, sumLogF: dL, a: aOut, gain, F: dF };
}
