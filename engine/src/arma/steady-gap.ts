/**
 * The Kalman filter of kalman.ts through missing hours for a large state (a seasonal block),
 * with the covariance kept as that of the same filter without the gaps plus a low-rank
 * deviation, instead of the whole matrix.
 *
 * Let Q_t be the predicted covariance of the filter that observes every hour: its first row q_t
 * follows the Chandrasekhar recursions in O(r) an hour (Morf, Sidhu & Kailath 1974), and once it
 * is steady, Q∞ = T (Q∞ − q q'/G) T' + R R' with G = q₀. The filter with gaps has P_t = Q_t + D_t.
 * A missing hour adds to P what the update of Q took away:
 *   D_{t+1} = T D_t T' + (T q_t)(T q_t)'/G_t,
 * so after g missing hours D = W M W' has rank g (W is r × g, M g × g, positive semi-definite).
 * An observed hour updates both with the same data; the difference of two Riccati solutions
 * keeps its rank (Anderson & Moore 1979, §4.4, the algebra of the Chandrasekhar recursions):
 *   F_t = G_t + b'M b,  P_t Z' = q_t + W M b,  b = W' Z' (the first row of W),
 *   W_{t+1} = T (I − k_t Z) W_t,  k_t = q_t/G_t,  M_{t+1} = M − (M b)(M b)'/F_t.
 * Each hour costs O(r g + g²) instead of the O(r²) of the full Riccati step. g counts missing
 * hours only until D is brought down to its numerical rank (deviation-rank.ts), which on hourly
 * series with a seasonal block stays far below the count. Where it still grows too large, the
 * filter hands over to the full recursion with the gapless covariance rebuilt from its last r
 * first rows (gaplessCovarianceFromRows), losing nothing done so far. That step was
 * where a seasonal fit on a series with gaps spent its time: with the seasonal MA part near the
 * unit circle the filter is not steady within eight weeks, and one missing hour anywhere had the
 * whole covariance tracked from the first hour to the last. The result is the same filter: the
 * same innovations, variances and states, to round-off.
 */
import { reduceDeviationRank } from './deviation-rank';
import { scratchAtLeast } from './scratch';

/**
 * The eigenvalues of the deviation left out when it is brought down to its numerical rank, as
 * a share of the tolerance at which the filter calls P steady: a thousandth, so what is dropped
 * stays below what the steady switch already accepts by that much.
 */
const RANK_DROP = 1e-3;
/**
 * The rank at which the deviation is first brought down, and how far it may grow past what the
 * last reduction left before the next: an hour at rank g costs about 5 r g, a reduction about
 * as much as 40 hours at rank 8. Measured on the demand series with 28 missing values (every
 * differencing, seasonal block at 24): 4 and 2 take a pass 0.7–0.8 of the time that reducing
 * only at r/2 does, and about half of the time of the filter before any reduction.
 */
const RANK_FIRST = 4;
export const GAP_RANK_SLACK = 2;
/**
 * Whether the deviation has died away is checked every this many hours (a power of two), not
 * every hour: the check costs as much as the hour itself (O(r g)), and going on a few hours past
 * the point is the same filter. Passes 0.79–0.91 of the time on the demand series with missing
 * hours where the gapless filter settles; the same where it never does.
 */
const STEADY_CHECK_EVERY = 8;

/**
 * what filterThroughGaps carries in and out: Σ v²/F, Σ log F, hours used, Σ v v₁/F, Σ v₁²/F,
 * and how it ended (GAP_STEADY, GAP_FULL, GAP_RESTART or GAP_END)
 */
export const GAP_SUMS = 6;
/** steady again (or the series ended): P's first row is the steady one */
export const GAP_STEADY = 1;
/** handed over to the full recursion (or the series ended with the state kept): P is the whole covariance of the hour returned */
export const GAP_FULL = 0;
/** the deviation outgrew its rank (or the series ended with the state kept) within r hours of the first missing hour, the gapless filter still moving, so that its whole covariance cannot be rebuilt: run the filter again with P tracked */
export const GAP_RESTART = 2;
/** the series ended before the filter was steady again (the sums are complete, P is not) */
export const GAP_END = 3;

/**
 * The filter from hour `from` (a missing one) until it is steady again, the deviation's rank
 * would pass `maxRank`, or the series ends. P's first row is q_from (the gapless filter's);
 * when `w` is given the gapless filter is still moving (w and mw its Chandrasekhar w_t and m_t,
 * only P's first row is read and kept up to date), otherwise it is steady and P holds the whole
 * of Q∞ (upper triangle, stride r + 1). phi, a, c and w are padded to r + 1 with a zero. a (and
 * c with `profile`: the column of ones of the GLS mean) are updated in place, the running sums
 * in `sums` (GAP_SUMS elements) carried on; residuals and predictions are written when asked for.
 *
 * Returns the hour after the last one run, and how it ended in sums[5]: GAP_STEADY when the
 * filter is steady again (P's first row is then the steady one; the rest of P is Q∞ only if it
 * was on entry); GAP_FULL when it hands over to the full recursion, P then holding the whole
 * predicted covariance of the hour returned (that hour not run yet), as it does at the end of
 * the series with `keepAtEnd`; GAP_RESTART when the rank ran out (or the series ended with
 * `keepAtEnd`) within r hours of `from` while the gapless filter was still moving, so that its
 * whole covariance cannot be rebuilt; GAP_END when the series ended first.
 */
export function filterThroughGaps(
  x: Float64Array,
  from: number,
  mu0: number,
  r: number,
  phi: Float64Array,
  R: Float64Array,
  P: Float64Array,
  a: Float64Array,
  c: Float64Array,
  profile: boolean,
  res: Float64Array,
  pred: Float64Array,
  tol: number,
  maxRank: number,
  keepAtEnd: boolean,
  sums: Float64Array,
  w: Float64Array | null,
  mw0: number,
): number {
  const n = x.length;
  const s = r + 1;
  const wantRes = res.length > 0;
  const wantPred = pred.length > 0;
  // W column by column (stride s, element r of each column zero), M row-major (stride maxRank)
  const W = scratchAtLeast('gap.W', s * maxRank);
  const M = scratchAtLeast('gap.M', maxRank * maxRank);
  const mb = scratchAtLeast('gap.mb', maxRank);
  const pc = scratchAtLeast('gap.pc', s);
  const wn = scratchAtLeast('gap.wn', s);
  // the gapless filter's first rows of the last r hours (row t mod r), from which its whole
  // covariance is rebuilt at a hand-over (gaplessCovarianceFromRows)
  const rows = scratchAtLeast('gap.rows', r * s);
  pc[r] = 0;
  let moving = w !== null;
  const fullQ = !moving;
  let mw = mw0;
  let ssq = sums[0];
  let sumLogF = sums[1];
  let nUsed = sums[2];
  let sxy = sums[3];
  let sxx = sums[4];
  let g = 0;
  let limit = Math.min(maxRank, RANK_FIRST);
  let t = from;
  let ended = GAP_STEADY;
  let reachedEnd = true;
  for (; t < n; t++) {
    const y = x[t] - mu0;
    if (wantPred) pred[t] = a[0] + mu0;
    const G = P[0];
    const observed = y === y;
    if (!fullQ) {
      const o = (t % r) * s;
      for (let i = 0; i < r; i++) rows[o + i] = P[i];
      rows[o + r] = 0;
    }
    if (!observed) {
      // out of rank: the deviation down to its numerical rank first (deviation-rank.ts), and
      // handed over where that leaves it too close to its limit to be worth going on
      if (g === limit) {
        g = reduceDeviationRank(W, M, r, s, g, maxRank, tol * RANK_DROP);
        limit = Math.min(maxRank, g + GAP_RANK_SLACK);
      }
      if (g + GAP_RANK_SLACK > maxRank) {
        ended = moving && t - from < r ? GAP_RESTART : GAP_FULL;
        reachedEnd = false;
        break;
      }
      if (wantRes) res[t] = NaN;
      const a0 = a[0];
      for (let i = 0; i < r; i++) a[i] = phi[i] * a0 + a[i + 1];
      if (profile) {
        const c0 = c[0];
        for (let i = 0; i < r; i++) c[i] = phi[i] * c0 + c[i + 1];
      }
      // D ← T D T' + u u'/G with u = T q: every column through T, then u as a column of its own
      for (let j = 0; j < g; j++) {
        const o = j * s;
        const w0 = W[o];
        for (let i = 0; i < r; i++) W[o + i] = phi[i] * w0 + W[o + i + 1];
      }
      const o = g * s;
      for (let i = 0; i < r; i++) W[o + i] = phi[i] * G + (i + 1 < r ? P[i + 1] : 0);
      W[o + r] = 0;
      for (let l = 0; l < g; l++) {
        M[g * maxRank + l] = 0;
        M[l * maxRank + g] = 0;
      }
      M[g * maxRank + g] = 1 / G;
      g++;
    } else {
      // F_t = G + b'M b and the first column of P_t, q + W M b
      let delta = 0;
      for (let j = 0; j < g; j++) {
        let sum = 0;
        const row = j * maxRank;
        for (let l = 0; l < g; l++) sum += M[row + l] * W[l * s];
        mb[j] = sum;
        delta += W[j * s] * sum;
      }
      for (let i = 0; i < r; i++) pc[i] = P[i];
      for (let j = 0; j < g; j++) {
        const o = j * s;
        const m = mb[j];
        for (let i = 0; i < r; i++) pc[i] += W[o + i] * m;
      }
      const Ft = G + delta;
      const ginv = 1 / Ft;
      const v = y - a[0];
      const vf = v * ginv;
      ssq += v * vf;
      sumLogF += Math.log(Ft);
      nUsed++;
      if (wantRes) res[t] = v / Math.sqrt(Ft);
      const af0 = a[0] + pc[0] * vf;
      for (let i = 0; i < r; i++) a[i] = phi[i] * af0 + a[i + 1] + pc[i + 1] * vf;
      if (profile) {
        const v1 = 1 - c[0];
        const v1f = v1 * ginv;
        sxy += v1 * vf;
        sxx += v1 * v1f;
        const cf0 = c[0] + pc[0] * v1f;
        for (let i = 0; i < r; i++) c[i] = phi[i] * cf0 + c[i + 1] + pc[i + 1] * v1f;
      }
      // W ← T (I − k Z) W, which is (T (I − k Z) x)_i = x_{i+1} − k_{i+1} x₀ since k₀ = 1;
      // M ← M − (M b)(M b)'/F_t
      const Ginv = 1 / G;
      for (let j = 0; j < g; j++) {
        const o = j * s;
        const w0 = W[o] * Ginv;
        for (let i = 0; i < r; i++) W[o + i] = W[o + i + 1] - (i + 1 < r ? P[i + 1] : 0) * w0;
      }
      for (let j = 0; j < g; j++) {
        const row = j * maxRank;
        const mj = mb[j] * ginv;
        for (let l = 0; l < g; l++) M[row + l] -= mj * mb[l];
      }
    }
    if (moving) {
      // the gapless filter's own step (its covariance does not depend on the data): as in
      // quickStartUp, w_{t+1} = T (w − q (Z w)/G), q ← q + m (Z w) w, m ← m − m² (Z w)²/G_{t+1}
      const v = w as Float64Array;
      const zw = v[0];
      const coef = zw / G;
      const mz = mw * zw;
      let wmax = 0;
      for (let i = 0; i < r; i++) {
        const q1 = i + 1 < r ? P[i + 1] : 0;
        const wi = v[i];
        wn[i] = v[i + 1] - q1 * coef;
        const w2 = wi * wi;
        if (w2 > wmax) wmax = w2;
      }
      for (let i = 0; i < r; i++) P[i] += mz * v[i];
      for (let i = 0; i < r; i++) v[i] = wn[i];
      const change = Math.abs(mw) * wmax;
      mw -= (mz * mz) / P[0];
      if (change < tol) moving = false;
    }
    if (observed && !moving && (t & (STEADY_CHECK_EVERY - 1)) === 0) {
      // a bound on every element of D = W M W' (positive semi-definite: |D_ij| ≤ max_i D_ii
      // ≤ λ_max(M) max_i |W_i·|² ≤ tr M · max_i |W_i·|²)
      let trace = 0;
      for (let j = 0; j < g; j++) trace += M[j * maxRank + j];
      let rowMax = 0;
      for (let i = 0; i < r; i++) {
        let sq = 0;
        for (let j = 0; j < g; j++) {
          const wij = W[j * s + i];
          sq += wij * wij;
        }
        if (sq > rowMax) rowMax = sq;
      }
      if (trace * rowMax < tol) {
        t++;
        ended = GAP_STEADY;
        reachedEnd = false;
        break;
      }
    }
  }
  if (reachedEnd) ended = !keepAtEnd ? GAP_END : moving && t - from < r ? GAP_RESTART : GAP_FULL;
  sums[0] = ssq;
  sums[1] = sumLogF;
  sums[2] = nUsed;
  sums[3] = sxy;
  sums[4] = sxx;
  sums[5] = ended;
  if (ended === GAP_FULL) {
    if (!fullQ) gaplessCovarianceFromRows(P, rows, R, r, t);
    addDeviation(P, W, M, r, g, maxRank);
  }
  return t;
}

/**
 * The whole steady predicted covariance (upper triangle, stride r + 1) from its first row, in
 * place. At the steady state P = T (P − p p'/F) T' + R R' with p = P e₀ and F = p₀; the first
 * row and column of P − p p'/F vanish, so by the shift structure of T
 *   P_ij = P_{i+1,j+1} − p_{i+1} p_{j+1} / F + R_i R_j,
 * filled from the last row up (row r is the zero padding). O(r²).
 */
export function steadyCovarianceFromRow(P: Float64Array, R: Float64Array, r: number): void {
  const s = r + 1;
  const F = P[0];
  for (let i = r - 1; i >= 1; i--) {
    const pi = P[i + 1] / F; // p_{i+1}/F (P[r] is the padding: 0)
    const below = (i + 1) * s + 1;
    for (let j = i; j < r; j++) P[i * s + j] = P[below + j] - pi * P[j + 1] + R[i] * R[j];
  }
}

/**
 * The whole predicted covariance Q_t of the gapless filter (upper triangle, stride r + 1, into
 * P) from its first rows q of the r hours before t (`rows`, hour u at row u mod r, each with
 * its padding zero). Its first row is q_t, already in P. Each hour Q_{u+1} = T (Q_u − q_u q_u'/G_u) T'
 * + R R' with G_u = q_u,0, and the first row and column of Q_u − q_u q_u'/G_u vanish, so by the
 * shift structure of T
 *   Q_{u+1},ij = Q_u,i+1,j+1 − q_u,i+1 q_u,j+1 / G_u + R_i R_j,
 * and unrolled back r hours (indices past r − 1 are zero)
 *   Q_t,ij = Σ_{l=1}^{r−j} (R_{i+l−1} R_{j+l−1} − q_{t−l},i+l q_{t−l},j+l / G_{t−l}),  0 < i ≤ j.
 * At the steady state every q is the same and this is steadyCovarianceFromRow. O(r³), once.
 */
function gaplessCovarianceFromRows(P: Float64Array, rows: Float64Array, R: Float64Array, r: number, t: number): void {
  const s = r + 1;
  for (let i = 1; i < r; i++) {
    for (let j = i; j < r; j++) {
      let sum = 0;
      for (let l = 1; j + l <= r; l++) {
        const o = (((t - l) % r) + r) % r * s;
        const q = rows[o + i + l] * rows[o + j + l];
        sum += R[i + l - 1] * R[j + l - 1] - q / rows[o];
      }
      P[i * s + j] = sum;
    }
  }
}

/** P ← P + W M W' on the upper triangle (stride r + 1). */
function addDeviation(P: Float64Array, W: Float64Array, M: Float64Array, r: number, g: number, maxRank: number): void {
  const s = r + 1;
  // V = M W' (g × r, row-major), then P_ij += Σ_l W_il V_lj
  const V = scratchAtLeast('gap.V', Math.max(1, g * r));
  for (let l = 0; l < g; l++) {
    for (let j = 0; j < r; j++) {
      let sum = 0;
      for (let k = 0; k < g; k++) sum += M[l * maxRank + k] * W[k * s + j];
      V[l * r + j] = sum;
    }
  }
  for (let i = 0; i < r; i++) {
    for (let j = i; j < r; j++) {
      let sum = 0;
      for (let l = 0; l < g; l++) sum += W[l * s + i] * V[l * r + j];
      P[i * s + j] += sum;
    }
  }
}
