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
 * stationary covariance (state-space.ts). Exact, unlike differences, and the base recursion
 * runs once for all k directions.
 */
import { scratch, scratchAtLeast } from './scratch';
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
  if (r <= 4) return smallTangents(x, ss, dPhi, start.row, start.dRow, k, t0);
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

/** Values of the base recursion each tangent step reads, per hour (smallTangents). */
const TRAJ = 16;

/**
 * The same for up to four states, one direction at a time with the tangent state in scalars:
 * the base recursion runs once and leaves, per hour, what the tangent steps read (TRAJ values),
 * so that a direction's whole pass over the start-up needs no arrays of its own.
 */
function smallTangents(x: Float64Array, ss: ArmaStateSpace, dPhi: Float64Array, row: Float64Array, dRow: Float64Array, k: number, t0: number): StartUpTangents {
  const { r, phi } = ss;
  const ph0 = phi[0];
  const ph1 = r > 1 ? phi[1] : 0;
  const ph2 = r > 2 ? phi[2] : 0;
  const ph3 = r > 3 ? phi[3] : 0;
  const p00 = row[0];
  let p0 = p00;
  let p1 = r > 1 ? row[1] : 0;
  let p2 = r > 2 ? row[2] : 0;
  let p3 = r > 3 ? row[3] : 0;
  let w0 = ph0 * p0 + p1;
  let w1 = ph1 * p0 + p2;
  let w2 = ph2 * p0 + p3;
  let w3 = ph3 * p0;
  let a0 = 0;
  let a1 = 0;
  let a2 = 0;
  let a3 = 0;
  let m = -1 / p0;
  const traj = scratchAtLeast('tangents.traj', (t0 + 1) * TRAJ);
  for (let t = 0; t <= t0; t++) {
    const y = x[t];
    const ginv = 1 / p0;
    const v = y - a0;
    const vf = v * ginv;
    const coef = w0 * ginv;
    const mz = m * w0;
    const o = t * TRAJ;
    traj[o] = y;
    traj[o + 1] = v;
    traj[o + 2] = vf;
    traj[o + 3] = ginv;
    traj[o + 4] = w0;
    traj[o + 5] = coef;
    traj[o + 6] = m;
    traj[o + 7] = mz;
    traj[o + 9] = p1;
    traj[o + 10] = p2;
    traj[o + 11] = p3;
    traj[o + 12] = w0;
    traj[o + 13] = w1;
    traj[o + 14] = w2;
    traj[o + 15] = w3;
    a0 = ph0 * y + a1 + p1 * vf;
    a1 = ph1 * y + a2 + p2 * vf;
    a2 = ph2 * y + a3 + p3 * vf;
    a3 = ph3 * y;
    const nw0 = w1 - p1 * coef;
    const nw1 = w2 - p2 * coef;
    const nw2 = w3 - p3 * coef;
    p0 += mz * w0;
    p1 += mz * w1;
    p2 += mz * w2;
    p3 += mz * w3;
    w0 = nw0;
    w1 = nw1;
    w2 = nw2;
    w3 = 0;
    traj[o + 8] = p0;
    m -= (mz * mz) / p0;
  }
  const F = p0;
  const pEnd = [p0, p1, p2, p3];
  const dS = new Float64Array(k);
  const dL = new Float64Array(k);
  const aOut = new Float64Array(k * r);
  const gain = new Float64Array(k * r);
  const dF = new Float64Array(k);
  for (let j = 0; j < k; j++) {
    const or = j * r;
    const f0 = dPhi[or];
    const f1 = r > 1 ? dPhi[or + 1] : 0;
    const f2 = r > 2 ? dPhi[or + 2] : 0;
    const f3 = r > 3 ? dPhi[or + 3] : 0;
    let dp0 = dRow[or];
    let dp1 = r > 1 ? dRow[or + 1] : 0;
    let dp2 = r > 2 ? dRow[or + 2] : 0;
    let dp3 = r > 3 ? dRow[or + 3] : 0;
    let dw0 = f0 * p00 + ph0 * dp0 + dp1;
    let dw1 = f1 * p00 + ph1 * dp0 + dp2;
    let dw2 = f2 * p00 + ph2 * dp0 + dp3;
    let dw3 = f3 * p00 + ph3 * dp0;
    let dm = dp0 / (p00 * p00);
    let da0 = 0;
    let da1 = 0;
    let da2 = 0;
    let da3 = 0;
    let sS = 0;
    let sL = 0;
    for (let t = 0; t <= t0; t++) {
      const o = t * TRAJ;
      const y = traj[o];
      const v = traj[o + 1];
      const vf = traj[o + 2];
      const ginv = traj[o + 3];
      const zw = traj[o + 4];
      const coef = traj[o + 5];
      const mw = traj[o + 6];
      const mz = traj[o + 7];
      const p0n = traj[o + 8];
      const q1 = traj[o + 9];
      const q2 = traj[o + 10];
      const q3 = traj[o + 11];
      const dginv = -dp0 * ginv * ginv;
      const dv = -da0;
      const dvf = dv * ginv + v * dginv;
      sS += dv * vf + v * dvf;
      sL += dp0 * ginv;
      const dcoef = dw0 * ginv + zw * dginv;
      const dmz = dm * zw + mw * dw0;
      da0 = f0 * y + da1 + dp1 * vf + q1 * dvf;
      da1 = f1 * y + da2 + dp2 * vf + q2 * dvf;
      da2 = f2 * y + da3 + dp3 * vf + q3 * dvf;
      da3 = f3 * y;
      const ndw0 = dw1 - dp1 * coef - q1 * dcoef;
      const ndw1 = dw2 - dp2 * coef - q2 * dcoef;
      const ndw2 = dw3 - dp3 * coef - q3 * dcoef;
      dp0 += dmz * traj[o + 12] + mz * dw0;
      dp1 += dmz * traj[o + 13] + mz * dw1;
      dp2 += dmz * traj[o + 14] + mz * dw2;
      dp3 += dmz * traj[o + 15] + mz * dw3;
      dw0 = ndw0;
      dw1 = ndw1;
      dw2 = ndw2;
      dw3 = 0;
      dm += (-2 * mz * dmz) / p0n + (mz * mz * dp0) / (p0n * p0n);
    }
    dS[j] = sS;
    dL[j] = sL;
    dF[j] = dp0;
    const da = [da0, da1, da2, da3];
    const dp = [dp0, dp1, dp2, dp3];
    for (let i = 0; i < r; i++) {
      aOut[or + i] = da[i];
      gain[or + i] = dp[i] / F - (pEnd[i] * dp0) / (F * F);
    }
  }
  return { ssq: dS, sumLogF: dL, a: aOut, gain, F: dF };
}
