/**
 * Kalman filter for the ARMA state-space form (Kalman 1960; Harvey 1989; Durbin & Koopman 2012)
 * giving the exact Gaussian likelihood with σ² concentrated out:
 *   log L = −½ [ n log(2π σ̂²) + Σ log F_t + n ],  σ̂² = (1/n) Σ v_t² / F_t,
 * v_t the one-step prediction errors, F_t their variances in units of σ², n the observed count.
 * Missing observations (NaN) are skipped: the state is predicted through them without update.
 * Once the predicted covariance stops changing, the filter switches to the steady-state
 * recursion with a fixed gain (the "quick recursions" of Gardner, Harvey & Phillips 1980), which
 * costs O(r) per step instead of O(r²); a missing value switches back to the full recursion.
 *
 * A constant mean can be concentrated out as a GLS regression coefficient by filtering a
 * column of ones alongside the data with the same gains (the augmented filter of de Jong 1991).
 */
import { ArmaStateSpace, stationaryCovariance, stationaryCovarianceFirstRow } from './state-space';
import { filterThroughGaps, GAP_RANK_SLACK, GAP_RESTART, GAP_STEADY, GAP_SUMS, steadyCovarianceFromRow } from './steady-gap';

export { steadyCovarianceFromRow };

export interface FilterOptions {
  /** Subtract this known mean before filtering. */
  mean?: number;
  /** Estimate the mean by GLS inside the filter (ignored when `mean` is given). */
  profileMean?: boolean;
  /** Convergence tolerance on the predicted covariance for the steady-state switch. */
  tol?: number;
  /** Fill with standardized innovations v_t/√F_t (NaN where missing). */
  residuals?: Float64Array;
  /** Fill with the one-step predictions of x_t (including the mean). */
  predictions?: Float64Array;
  /** Keep the final predicted state a_{n+1|n} and covariance P_{n+1|n}. */
  keepState?: boolean;
  /**
   * Whether the series has no missing value, when the caller knows (a fit filters the same
   * series hundreds of times; looking for gaps each time cost a fifth of a pass). Looked up
   * here otherwise.
   */
  complete?: boolean;
  /**
   * Run the hours 0..stopAt only, with the time-varying recursions throughout (no steady-state
   * switch), and return with `entry` describing where they stopped: the start-up stretch on its
   * own, what the steady-state score differentiates (its backward pass over the start-up,
   * chandrasekhar-score.ts, is checked against differences of this).
   */
  stopAt?: number;
  /**
   * Fill with the predicted a_{t,0} (mean removed) for the hours after the first steady-state
   * switch, and return `entry` for that switch: what the steady-state score needs from the
   * pass that evaluated the likelihood.
   */
  trace?: Float64Array;
  /**
   * With `profileMean` and `trace`: fill with the predicted state of the column of ones c_{t,0}
   * for the same hours, and return in `entry.ones` what the start-up left for it. The filter is
   * linear in the data with gains that do not depend on it, so the predictions of x − μ are
   * a_{t,0} − μ c_{t,0} and the start-up's Σ (v − μ v₁)²/F is Σ v²/F − 2μ Σ v v₁/F + μ² Σ v₁²/F:
   * the pass over x − μ̂ the steady-state score needs, without running it.
   */
  traceOnes?: Float64Array;
}

/** The filter at the end of a start-up stretch: hours 0..steadyAt run. */
export interface SteadyEntry {
  steadyAt: number;
  /** Σ v_t²/F_t and Σ log F_t over hours 0..steadyAt */
  ssq: number;
  sumLogF: number;
  /** predicted state a_{steadyAt+1} */
  a: Float64Array;
  /** gain P_{steadyAt+1}[·,0] / F */
  gain: Float64Array;
  /** F = P_{steadyAt+1}[0,0], in units of σ² */
  F: number;
  /** with `traceOnes`: the column of ones' predicted state and Σ v v₁/F, Σ v₁²/F over the start-up */
  ones?: { c: Float64Array; sxy: number; sxx: number };
}

export interface FilterResult {
  ssq: number;
  sumLogF: number;
  nUsed: number;
  mean: number;
  /** step at which the steady state was reached (−1 if never) */
  steadyAt: number;
  aPred?: Float64Array;
  PPred?: Float64Array;
  /** with `stopAt`, or `trace` and a steady-state switch */
  entry?: SteadyEntry;
}

/**
 * The filter's arrays for one state size, allocated once (zeroed) and reused by every call: a
 * fit filters the same series hundreds of times, and a dozen allocations (or lookups and
 * clearings) per call were a quarter of a 2,000-hour pass. Each array is padded to stride
 * s = r + 1 and its padding (element r, row and column r) is never written, so it stays zero;
 * the used parts are written before they are read on every call, except a and c, which are
 * cleared. One filter runs at a time per thread (it calls nothing that filters).
 */
interface Workspace {
  phi: Float64Array;
  P: Float64Array;
  Pn: Float64Array;
  /** the stationary covariance, r×r unpadded */
  P0: Float64Array;
  RR: Float64Array;
  a: Float64Array;
  /** state of the filtered column of ones (profile mean) */
  c: Float64Array;
  /** gain P[·,0]/F */
  K: Float64Array;
  /** T P[·,0] */
  g: Float64Array;
  w: Float64Array;
  wn: Float64Array;
  /** the steady recursion's constants c_0..c_3, d_0..d_3 */
  cd: Float64Array;
  /** what quickStartUp hands back: Σ v²/F, Σ log F, whether it reached the steady state (and
   *  with the mean profiled out Σ v·v₁/F, Σ v₁²/F) */
  sums: Float64Array;
  /** the steady state handed to and from tracedStretch */
  st: Float64Array;
  /** the data's and the column of ones' steady states handed to and from tracedProfileStretch */
  st8: Float64Array;
  /** what quickStartUpSmall reads and writes */
  io: Float64Array;
  /** the running sums handed to and from filterThroughGaps */
  gapSums: Float64Array;
}
const workspaces = new Map<number, Workspace>();
function workspaceFor(r: number): Workspace {
  let ws = workspaces.get(r);
  if (!ws) {
    const s = r + 1;
    const v = () => new Float64Array(s);
    const m = () => new Float64Array(s * s);
    ws = { phi: v(), P: m(), Pn: m(), P0: new Float64Array(r * r), RR: m(), a: v(), c: v(), K: v(), g: v(), w: v(), wn: v(), cd: new Float64Array(8), sums: new Float64Array(5), st: new Float64Array(4), st8: new Float64Array(8), io: new Float64Array(20), gapSums: new Float64Array(GAP_SUMS) };
    workspaces.set(r, ws);
  }
  return ws;
}

/**
 * The steady recursion for up to four states over hours from..end−1, writing the predictions
 * a_{t,0} to tr; the state in and out through st (four elements: unused states are zero and
 * stay so, since c and d are zero there), c and d in cd. Returns Σ v². Every element access
 * is unconditional: this runs once per pass, is entered through on-stack replacement, and an
 * access that had never run before (a fourth state) threw its compiled code away each time.
 */
function tracedStretch(x: Float64Array, from: number, end: number, mu0: number, st: Float64Array, cd: Float64Array, tr: Float64Array): number {
  const c0 = cd[0];
  const c1 = cd[1];
  const c2 = cd[2];
  const c3 = cd[3];
  const d0 = cd[4];
  const d1 = cd[5];
  const d2 = cd[6];
  const d3 = cd[7];
  let a0 = st[0];
  let a1 = st[1];
  let a2 = st[2];
  let a3 = st[3];
  let sv = 0;
  for (let u = from; u < end; u++) {
    const yu = x[u] - mu0;
    tr[u] = a0;
    const v = yu - a0;
    sv += v * v;
    const na0 = c0 * a0 + (d0 * yu + a1);
    a1 = c1 * a0 + (d1 * yu + a2);
    a2 = c2 * a0 + (d2 * yu + a3);
    a3 = c3 * a0 + d3 * yu;
    a0 = na0;
  }
  st[0] = a0;
  st[1] = a1;
  st[2] = a2;
  st[3] = a3;
  return sv;
}

/**
 * The steady recursion of tracedStretch writing what a final pass keeps instead of the trace:
 * the standardised innovations v/√F (when res is not empty) and the predictions a_{t,0} + μ
 * (when pred is not empty). Returns Σ v². The pass that makes a fit's residuals, predictions and
 * final state (and the hourly update's) took the general loop over the whole steady stretch,
 * several times the cost of a likelihood pass.
 */
function steadyStretchWithOutputs(x: Float64Array, from: number, end: number, mu0: number, st: Float64Array, cd: Float64Array, invSqrtF: number, res: Float64Array, pred: Float64Array): number {
  const c0 = cd[0];
  const c1 = cd[1];
  const c2 = cd[2];
  const c3 = cd[3];
  const d0 = cd[4];
  const d1 = cd[5];
  const d2 = cd[6];
  const d3 = cd[7];
  const wantRes = res.length > 0;
  const wantPred = pred.length > 0;
  let a0 = st[0];
  let a1 = st[1];
  let a2 = st[2];
  let a3 = st[3];
  let sv = 0;
  for (let u = from; u < end; u++) {
    const yu = x[u] - mu0;
    if (wantPred) pred[u] = a0 + mu0;
    const v = yu - a0;
    if (wantRes) res[u] = v * invSqrtF;
    sv += v * v;
    const na0 = c0 * a0 + (d0 * yu + a1);
    a1 = c1 * a0 + (d1 * yu + a2);
    a2 = c2 * a0 + (d2 * yu + a3);
    a3 = c3 * a0 + d3 * yu;
    a0 = na0;
  }
  st[0] = a0;
  st[1] = a1;
  st[2] = a2;
  st[3] = a3;
  return sv;
}

/**
 * The steady recursion with the mean profiled out (the data's state a and the column of ones'
 * state c, both by the fixed recursion; see kalmanFilter) over hours from..end−1, writing the
 * predictions a_{t,0} to tr and c_{t,0} to tr1; states in and out through st (a in 0–3, c in
 * 4–7). Writes Σ v², Σ v v₁ and Σ v₁² to sums[0], sums[3] and sums[4].
 */
function tracedProfileStretch(x: Float64Array, from: number, end: number, mu0: number, st: Float64Array, cd: Float64Array, tr: Float64Array, tr1: Float64Array, sums: Float64Array): void {
  const c0 = cd[0];
  const c1 = cd[1];
  const c2 = cd[2];
  const c3 = cd[3];
  const d0 = cd[4];
  const d1 = cd[5];
  const d2 = cd[6];
  const d3 = cd[7];
  let a0 = st[0];
  let a1 = st[1];
  let a2 = st[2];
  let a3 = st[3];
  let o0 = st[4];
  let o1 = st[5];
  let o2 = st[6];
  let o3 = st[7];
  let svv = 0;
  let sv1 = 0;
  let s11 = 0;
  for (let u = from; u < end; u++) {
    const yu = x[u] - mu0;
    tr[u] = a0;
    tr1[u] = o0;
    const v = yu - a0;
    const v1 = 1 - o0;
    svv += v * v;
    sv1 += v1 * v;
    s11 += v1 * v1;
    const na0 = c0 * a0 + (d0 * yu + a1);
    a1 = c1 * a0 + (d1 * yu + a2);
    a2 = c2 * a0 + (d2 * yu + a3);
    a3 = c3 * a0 + d3 * yu;
    a0 = na0;
    const no0 = c0 * o0 + (d0 + o1);
    o1 = c1 * o0 + (d1 + o2);
    o2 = c2 * o0 + (d2 + o3);
    o3 = c3 * o0 + d3;
    o0 = no0;
  }
  st[0] = a0;
  st[1] = a1;
  st[2] = a2;
  st[3] = a3;
  st[4] = o0;
  st[5] = o1;
  st[6] = o2;
  st[7] = o3;
  sums[0] = svv;
  sums[3] = sv1;
  sums[4] = s11;
}

/**
 * The steady gain K = P[·,0]/F into K, and the steady recursion's constants for up to four
 * states into cd: c_i = φ_i (1 − k_0) − k_{i+1}, then d_i = φ_i k_0 + k_{i+1} (K and φ are zero
 * beyond r, so the unused constants come out zero).
 */
function steadyConstants(P: Float64Array, phi: Float64Array, r: number, K: Float64Array, cd: Float64Array): Float64Array {
  const F = P[0];
  for (let i = 0; i < r; i++) K[i] = P[i] / F;
  const k0 = K[0];
  for (let i = 0; i < 4; i++) {
    const phii = i < r ? phi[i] : 0;
    const next = i + 1 < r ? K[i + 1] : 0;
    cd[i] = phii * (1 - k0) - next;
    cd[4 + i] = phii * k0 + next;
  }
  return cd;
}

/**
 * The Chandrasekhar start-up of kalmanFilter for a complete series, likelihood only: hours from
 * 0 until the covariance stops changing (or the end), updating the state a and the first row
 * of P in place. Writes Σ v²/F, Σ log F and whether the steady state was reached (1 or 0) to
 * sums, and leaves w_t in wIn and m_t in sums[3] (t the hour after the last one run); returns
 * the last hour run. The same recursions as the general loop, with what an
 * observed hour makes exact used (a_{t|t,0} = y_t; the first element of w − P Z'(Z w)/F is
 * zero) and one division per hour: 1/F of the next hour also updates m.
 */
function quickStartUp(x: Float64Array, mu0: number, r: number, phi: Float64Array, P: Float64Array, a: Float64Array, wIn: Float64Array, wnIn: Float64Array, mw0: number, tol: number, sums: Float64Array): number {
  const n = x.length;
  let w = wIn;
  let wn = wnIn;
  let mw = mw0;
  let ssq = 0;
  let sumLogF = 0;
  let prodF = 1;
  let inProd = 0;
  let ginv = 1 / P[0];
  let t = 0;
  let reached = 0;
  for (; t < n; t++) {
    const y = x[t] - mu0;
    const F = P[0];
    const v = y - a[0];
    const vf = v * ginv;
    ssq += v * vf;
    prodF *= F;
    if (++inProd === 4) {
      sumLogF += Math.log(prodF);
      prodF = 1;
      inProd = 0;
    }
    const zw = w[0];
    const coef = zw * ginv;
    const mz = mw * zw;
    let wmax = 0;
    for (let i = 0; i < r; i++) {
      const pi1 = P[i + 1];
      const wi = w[i];
      a[i] = phi[i] * y + a[i + 1] + pi1 * vf;
      wn[i] = w[i + 1] - pi1 * coef;
      P[i] += mz * wi;
      const w2 = wi * wi;
      wmax = w2 > wmax ? w2 : wmax;
    }
    const change = Math.abs(mw) * wmax;
    ginv = 1 / P[0];
    mw -= mz * mz * ginv;
    const tmp = w;
    w = wn;
    wn = tmp;
    if (change < tol) {
      reached = 1;
      break;
    }
  }
  if (inProd > 0) sumLogF += Math.log(prodF);
  sums[0] = ssq;
  sums[1] = sumLogF;
  sums[2] = reached;
  // where the recursions stopped, for a caller that carries them on: w_t back in wIn, m_t in sums[3]
  if (w !== wIn) for (let i = 0; i < r; i++) wIn[i] = w[i];
  sums[3] = mw;
  return Math.min(t, n - 1);
}

/**
 * quickStartUp for up to four states with everything in scalars (zero-padded: unused states
 * stay zero). io holds φ (0–3), the first row of P (4–7) and w (8–11) on entry, and the first
 * row of P (4–7) and the state a (12–15) on return; every element is read and written
 * unconditionally (see tracedStretch).
 */
function quickStartUpSmall(x: Float64Array, mu0: number, io: Float64Array, mw0: number, tol: number, sums: Float64Array): number {
  const n = x.length;
  const f0 = io[0];
  const f1 = io[1];
  const f2 = io[2];
  const f3 = io[3];
  let p0 = io[4];
  let p1 = io[5];
  let p2 = io[6];
  let p3 = io[7];
  let w0 = io[8];
  let w1 = io[9];
  let w2 = io[10];
  let w3 = io[11];
  let a0 = 0;
  let a1 = 0;
  let a2 = 0;
  let a3 = 0;
  let mw = mw0;
  let ssq = 0;
  let sumLogF = 0;
  let prodF = 1;
  let inProd = 0;
  let ginv = 1 / p0;
  let t = 0;
  let reached = 0;
  for (; t < n; t++) {
    const y = x[t] - mu0;
    const v = y - a0;
    const vf = v * ginv;
    ssq += v * vf;
    prodF *= p0;
    if (++inProd === 4) {
      sumLogF += Math.log(prodF);
      prodF = 1;
      inProd = 0;
    }
    const coef = w0 * ginv;
    const mz = mw * w0;
    a0 = f0 * y + a1 + p1 * vf;
    a1 = f1 * y + a2 + p2 * vf;
    a2 = f2 * y + a3 + p3 * vf;
    a3 = f3 * y;
    const nw0 = w1 - p1 * coef;
    const nw1 = w2 - p2 * coef;
    const nw2 = w3 - p3 * coef;
    const change = Math.abs(mw) * Math.max(w0 * w0, w1 * w1, w2 * w2, w3 * w3);
    p0 += mz * w0;
    p1 += mz * w1;
    p2 += mz * w2;
    p3 += mz * w3;
    w0 = nw0;
    w1 = nw1;
    w2 = nw2;
    w3 = 0;
    ginv = 1 / p0;
    mw -= mz * mz * ginv;
    if (change < tol) {
      reached = 1;
      break;
    }
  }
  if (inProd > 0) sumLogF += Math.log(prodF);
  io[4] = p0;
  io[5] = p1;
  io[6] = p2;
  io[7] = p3;
  io[12] = a0;
  io[13] = a1;
  io[14] = a2;
  io[15] = a3;
  sums[0] = ssq;
  sums[1] = sumLogF;
  sums[2] = reached;
  return Math.min(t, n - 1);
}

/**
 * quickStartUpSmall with the mean profiled out: the column of ones filtered beside the data with
 * the same gains (de Jong 1991), its state c and the sums Σ v·v₁/F and Σ v₁²/F of the GLS mean
 * carried in scalars too. io as for quickStartUpSmall, and c returned in 16–19; sums gets Σ v²/F,
 * Σ log F, whether the steady state was reached, Σ v·v₁/F and Σ v₁²/F. A copy of
 * quickStartUpSmall with the ones added rather than a flag in it: the plain start-up is the
 * loop a fit without a mean runs hundreds of times, and each line it does not need costs there.
 */
function quickStartUpSmallProfile(x: Float64Array, io: Float64Array, mw0: number, tol: number, sums: Float64Array): number {
  const n = x.length;
  const f0 = io[0];
  const f1 = io[1];
  const f2 = io[2];
  const f3 = io[3];
  let p0 = io[4];
  let p1 = io[5];
  let p2 = io[6];
  let p3 = io[7];
  let w0 = io[8];
  let w1 = io[9];
  let w2 = io[10];
  let w3 = io[11];
  let a0 = 0;
  let a1 = 0;
  let a2 = 0;
  let a3 = 0;
  let o0 = 0;
  let o1 = 0;
  let o2 = 0;
  let o3 = 0;
  let mw = mw0;
  let ssq = 0;
  let sxy = 0;
  let sxx = 0;
  let sumLogF = 0;
  let prodF = 1;
  let inProd = 0;
  let ginv = 1 / p0;
  let t = 0;
  let reached = 0;
  for (; t < n; t++) {
    const y = x[t];
    const v = y - a0;
    const v1 = 1 - o0;
    const vf = v * ginv;
    const v1f = v1 * ginv;
    ssq += v * vf;
    sxy += v1 * vf;
    sxx += v1 * v1f;
    prodF *= p0;
    if (++inProd === 4) {
      sumLogF += Math.log(prodF);
      prodF = 1;
      inProd = 0;
    }
    const coef = w0 * ginv;
    const mz = mw * w0;
    a0 = f0 * y + a1 + p1 * vf;
    a1 = f1 * y + a2 + p2 * vf;
    a2 = f2 * y + a3 + p3 * vf;
    a3 = f3 * y;
    o0 = f0 + o1 + p1 * v1f;
    o1 = f1 + o2 + p2 * v1f;
    o2 = f2 + o3 + p3 * v1f;
    o3 = f3;
    const nw0 = w1 - p1 * coef;
    const nw1 = w2 - p2 * coef;
    const nw2 = w3 - p3 * coef;
    const change = Math.abs(mw) * Math.max(w0 * w0, w1 * w1, w2 * w2, w3 * w3);
    p0 += mz * w0;
    p1 += mz * w1;
    p2 += mz * w2;
    p3 += mz * w3;
    w0 = nw0;
    w1 = nw1;
    w2 = nw2;
    w3 = 0;
    ginv = 1 / p0;
    mw -= mz * mz * ginv;
    if (change < tol) {
      reached = 1;
      break;
    }
  }
  if (inProd > 0) sumLogF += Math.log(prodF);
  io[4] = p0;
  io[5] = p1;
  io[6] = p2;
  io[7] = p3;
  io[12] = a0;
  io[13] = a1;
  io[14] = a2;
  io[15] = a3;
  io[16] = o0;
  io[17] = o1;
  io[18] = o2;
  io[19] = o3;
  sums[0] = ssq;
  sums[1] = sumLogF;
  sums[2] = reached;
  sums[3] = sxy;
  sums[4] = sxx;
  return Math.min(t, n - 1);
}

/** Stands in for an output that was not asked for (never written: its flag is false). */
const NO_OUTPUT = new Float64Array(0);

export function kalmanFilter(series: ArrayLike<number>, ss: ArmaStateSpace, opts: FilterOptions = {}): FilterResult {
  const { r, phi: phiIn, R } = ss;
  // The loop below sees only Float64Arrays and booleans: an optional output that is sometimes
  // undefined and sometimes an array makes V8 deoptimise the loop over and over, until it stops
  // optimising it at all (that alone made the filter several times slower).
  const x: Float64Array = series instanceof Float64Array ? series : Float64Array.from(series);
  const n = x.length;
  const tol = opts.tol ?? 1e-10;
  const profile = opts.mean === undefined && !!opts.profileMean;
  const mu0 = opts.mean ?? 0;
  // Everything below is stored with one row and column of zero padding (stride s = r + 1), so
  // the shift structure of T (ones on the superdiagonal) needs no bounds tests: element r of a
  // vector and row / column r of a matrix are always zero. Only the upper triangle (j ≥ i) of
  // the symmetric covariances is kept; P's first column is read from its first row.
  const s = r + 1;
  const ws = workspaceFor(r);
  const { phi, RR, a, c, K, g } = ws;
  for (let i = 0; i < r; i++) phi[i] = phiIn[i];
  let P = ws.P;
  let Pn = ws.Pn;
  const complete = opts.complete ?? !hasMissing(x);
  // the likelihood-only pass over a complete series reads only the first row of P (below)
  const firstRowOnly = complete && !opts.keepState && !profile && opts.residuals === undefined && opts.predictions === undefined && (opts.stopAt ?? -1) < 0;
  if (firstRowOnly) {
    const P0 = stationaryCovarianceFirstRow(ss, ws.P0);
    for (let j = 0; j < r; j++) P[j] = P0[j];
  } else {
    const P0 = stationaryCovariance(ss, ws.P0);
    for (let i = 0; i < r; i++) for (let j = i; j < r; j++) P[i * s + j] = P0[i * r + j];
  }
  for (let i = 0; i < r; i++) for (let j = i; j < r; j++) RR[i * s + j] = R[i] * R[j];
  a.fill(0);
  c.fill(0);
  // Chandrasekhar recursions (Morf, Sidhu & Kailath 1974; for ARMA likelihoods, Mélard 1984;
  // Herbst 2015): started from the stationary covariance, P_{t+1} − P_t has rank one, m_t w_t w_t',
  // and w_t, m_t and the first row of P (all the update needs) follow in O(r) per hour instead of
  // the O(r²) Riccati step. They hold until the first missing hour, where the full recursion takes
  // over; the whole of P is then kept up to date as well (a rank-one update), as it is when the
  // final state is wanted. w_0 = T P_0 Z', m_0 = −1/F_0, so this needs an observed first hour.
  let chandra = n > 0 && x[0] - mu0 === x[0] - mu0;
  const trackP = chandra && (!!opts.keepState || !complete);
  let w = ws.w;
  let wn = ws.wn;
  let mw = 0;
  if (chandra) {
    for (let i = 0; i < r; i++) w[i] = phi[i] * P[0] + P[i + 1];
    mw = -1 / P[0];
  }
  let steady = false;
  let Fss = 0;
  let logFss = 0;
  let steadyAt = -1;
  let prodF = 1;
  let inProd = 0;
  const stopAt = opts.stopAt ?? -1;
  const wantTrace = opts.trace !== undefined;
  const tr: Float64Array = opts.trace ?? NO_OUTPUT;
  const wantOnes = profile && wantTrace && opts.traceOnes !== undefined;
  const tr1: Float64Array = wantOnes ? (opts.traceOnes as Float64Array) : NO_OUTPUT;
  let entry: SteadyEntry | undefined;
  let ssq = 0;
  let sumLogF = 0;
  let nUsed = 0;
  let sxy = 0;
  let sxx = 0;
  const wantRes = opts.residuals !== undefined;
  const wantPred = opts.predictions !== undefined;
  const res: Float64Array = opts.residuals ?? NO_OUTPUT;
  const pred: Float64Array = opts.predictions ?? NO_OUTPUT;
  // likelihood only, small state: the steady-state stretches take the scalar loop below
  const fast = r <= 4 && !profile && !wantRes && !wantPred;
  // A large state through missing hours: the deviation from the gapless filter's covariance
  // grows by a rank with each missing hour and is brought down to its numerical rank on the way
  // (steady-gap.ts, deviation-rank.ts), here up to half the state's size: an hour of the
  // deviation at rank g costs about 5 r g, the full step 4 r². Not with the traced or stopped
  // passes of the steady-state score (complete series only).
  const lowRankGaps = r > 4 && !complete && !wantTrace && stopAt < 0;
  const gapRank = r >> 1;
  let tStart = 0;
  if (chandra && !trackP && complete && !profile && !wantRes && !wantPred && stopAt < 0) {
    // the likelihood-only case, the one a fit runs hundreds of times: the start-up in a
    // function of its own (below), then straight into the steady state
    const sums = ws.sums;
    let last: number;
    if (r <= 4) {
      // up to four states: the recursion in scalars, handed in and out through io
      const io = ws.io;
      for (let i = 0; i < 4; i++) {
        io[i] = i < r ? phi[i] : 0;
        io[4 + i] = i < r ? P[i] : 0;
        io[8 + i] = i < r ? w[i] : 0;
      }
      last = quickStartUpSmall(x, mu0, io, mw, tol, sums);
      for (let i = 0; i < r; i++) {
        P[i] = io[4 + i];
        a[i] = io[12 + i];
      }
    } else last = quickStartUp(x, mu0, r, phi, P, a, w, wn, mw, tol, sums);
    ssq = sums[0];
    sumLogF = sums[1];
    nUsed = last + 1;
    tStart = last + 1;
    if (sums[2] === 1) {
      if (wantTrace) entry = entryOf(last, ssq, sumLogF, a, P, r);
      steady = true;
      steadyAt = last;
      Fss = P[0];
      logFss = Math.log(Fss);
      steadyConstants(P, phi, r, K, ws.cd);
    }
  } else if (chandra && !trackP && complete && profile && r <= 4 && !wantRes && !wantPred && wantTrace === wantOnes && stopAt < 0) {
    // the same with the mean profiled out (the fit of a model with a mean): the start-up of the
    // data and of the column of ones in scalars, then the profiled steady loop below
    const io = ws.io;
    const sums = ws.sums;
    for (let i = 0; i < 4; i++) {
      io[i] = i < r ? phi[i] : 0;
      io[4 + i] = i < r ? P[i] : 0;
      io[8 + i] = i < r ? w[i] : 0;
    }
    const last = quickStartUpSmallProfile(x, io, mw, tol, sums);
    for (let i = 0; i < r; i++) {
      P[i] = io[4 + i];
      a[i] = io[12 + i];
      c[i] = io[16 + i];
    }
    ssq = sums[0];
    sumLogF = sums[1];
    sxy = sums[3];
    sxx = sums[4];
    nUsed = last + 1;
    tStart = last + 1;
    if (sums[2] === 1) {
      if (wantTrace) entry = entryWithOnes(last, ssq, sumLogF, a, P, r, c, sxy, sxx);
      steady = true;
      steadyAt = last;
      Fss = P[0];
      logFss = Math.log(Fss);
      steadyConstants(P, phi, r, K, ws.cd);
    }
  } else if (chandra && !complete && r > 4 && !opts.keepState && !profile && !wantRes && !wantPred && !wantTrace && stopAt < 0) {
    // The likelihood of a large state (a seasonal block) with missing hours: tracking the full
    // covariance from the start costs O(r²) an hour. So the start-up runs by the quick O(r)
    // recursions up to the first missing hour and, when the filter is steady by then, the whole
    // of P is rebuilt from its first row (steadyCovarianceFromRow); otherwise the filter goes on
    // through the gaps as the gapless one plus a low-rank deviation (steady-gap.ts) and, only
    // where that deviation outgrows its rank before the steady state, starts again with P tracked.
    const first = nextMissing(x, 0);
    const sums = ws.sums;
    const last = quickStartUp(x.subarray(0, first), mu0, r, phi, P, a, w, wn, mw, tol, sums);
    let ended = GAP_RESTART;
    // Where the deviation grows past its rank the filter hands over to the full recursion with
    // the whole covariance rebuilt (steady-gap.ts); only within r hours of the first missing
    // hour, the gapless covariance not yet rebuildable, does it start again with P tracked. The
    // hours of one day add independent directions, so with nearly half a state's worth of them
    // missing within those r hours (a feed down for half a day) it starts again at once.
    if (sums[2] !== 1 && missingWithin(x, first, first + r) + GAP_RANK_SLACK <= gapRank) {
      const gs = ws.gapSums;
      gs[0] = sums[0];
      gs[1] = sums[1];
      gs[2] = last + 1;
      gs[3] = 0;
      gs[4] = 0;
      const next = filterThroughGaps(x, first, mu0, r, phi, R, P, a, c, false, NO_OUTPUT, NO_OUTPUT, tol, gapRank, false, gs, w, sums[3]);
      ended = gs[5];
      if (ended !== GAP_RESTART) {
        ssq = gs[0];
        sumLogF = gs[1];
        nUsed = gs[2];
        tStart = next;
        chandra = false;
      }
      if (ended === GAP_STEADY) {
        steady = true;
        steadyAt = next - 1;
        Fss = P[0];
        logFss = Math.log(Fss);
        steadyConstants(P, phi, r, K, ws.cd);
        steadyCovarianceFromRow(P, R, r);
      }
    }
    if (sums[2] === 1) {
      ssq = sums[0];
      sumLogF = sums[1];
      nUsed = last + 1;
      tStart = last + 1;
      steady = true;
      steadyAt = last;
      Fss = P[0];
      logFss = Math.log(Fss);
      steadyConstants(P, phi, r, K, ws.cd);
      steadyCovarianceFromRow(P, R, r);
      chandra = false;
    } else if (ended === GAP_RESTART) {
      const P0 = ws.P0;
      for (let j = 0; j < r; j++) P[j] = P0[j];
      a.fill(0);
      for (let i = 0; i < r; i++) w[i] = phi[i] * P[0] + P[i + 1];
      mw = -1 / P[0];
    }
  }
  for (let t = tStart; t < n; t++) {
    const yt = x[t] - mu0;
    const observed = yt === yt;
    if (wantPred) pred[t] = a[0] + mu0;
    if (steady && observed && fast) {
      // the steady-state recursion with the state in local scalars, run until the next missing
      // value (states beyond r stay zero because φ and K are zero-padded)
      let a0 = a[0];
      let a1 = a[1];
      let a2 = r > 2 ? a[2] : 0;
      let a3 = r > 3 ? a[3] : 0;
      // the steady recursion's constants (steadyConstants): c_i = φ_i (1 − k_0) − k_{i+1},
      // d_i = φ_i k_0 + k_{i+1}
      const cd = ws.cd;
      const c0 = cd[0];
      const c1 = cd[1];
      const c2 = cd[2];
      const c3 = cd[3];
      const d0 = cd[4];
      const d1 = cd[5];
      const d2 = cd[6];
      const d3 = cd[7];
      let sv = 0;
      let u = t;
      // the stretch runs to the next missing hour; the loops below need no test for one
      const end = complete ? n : nextMissing(x, t);
      if (wantTrace) {
        // the four-state loop (unused states stay zero), writing each prediction down, in a
        // function of its own
        const st = ws.st;
        st[0] = a0;
        st[1] = a1;
        st[2] = a2;
        st[3] = a3;
        sv = tracedStretch(x, t, end, mu0, st, cd, tr);
        u = end;
        a0 = st[0];
        a1 = st[1];
        a2 = st[2];
        a3 = st[3];
      } else if (r <= 2) {
        // the same with two states: fewer live values, no spills
        for (; u < end; u++) {
          const yu = x[u] - mu0;
          const v = yu - a0;
          sv += v * v;
          const na0 = c0 * a0 + (d0 * yu + a1);
          a1 = c1 * a0 + d1 * yu;
          a0 = na0;
        }
      } else if (r === 3) {
        for (; u < end; u++) {
          const yu = x[u] - mu0;
          const v = yu - a0;
          sv += v * v;
          const na0 = c0 * a0 + (d0 * yu + a1);
          a1 = c1 * a0 + (d1 * yu + a2);
          a2 = c2 * a0 + d2 * yu;
          a0 = na0;
        }
      } else for (; u < end; u++) {
        const yu = x[u] - mu0;
        const v = yu - a0;
        sv += v * v;
        // a_i ← φ_i (a_0 + k_0 v) + a_{i+1} + k_{i+1} v with v = y − a_0, regrouped as
        // c_i a_0 + (d_i y + a_{i+1}): the next a_0 waits on one multiply-add, not on v first
        const na0 = c0 * a0 + (d0 * yu + a1);
        a1 = c1 * a0 + (d1 * yu + a2);
        a2 = c2 * a0 + (d2 * yu + a3);
        a3 = c3 * a0 + d3 * yu;
        a0 = na0;
      }
      a[0] = a0;
      if (r > 1) a[1] = a1;
      if (r > 2) a[2] = a2;
      if (r > 3) a[3] = a3;
      const m = u - t;
      ssq += sv / Fss;
      sumLogF += m * logFss;
      nUsed += m;
      t = u - 1;
      continue;
    }
    if (steady && observed && profile && r <= 4 && wantOnes && !wantRes && !wantPred) {
      // the same with both predictions written down (traceOnes), in a function of its own
      const st = ws.st8;
      for (let i = 0; i < 4; i++) {
        st[i] = i < r ? a[i] : 0;
        st[4 + i] = i < r ? c[i] : 0;
      }
      const end = complete ? n : nextMissing(x, t);
      const sums = ws.sums;
      tracedProfileStretch(x, t, end, mu0, st, ws.cd, tr, tr1, sums);
      for (let i = 0; i < r; i++) {
        a[i] = st[i];
        c[i] = st[4 + i];
      }
      const m = end - t;
      ssq += sums[0] / Fss;
      sxy += sums[3] / Fss;
      sxx += sums[4] / Fss;
      sumLogF += m * logFss;
      nUsed += m;
      t = end - 1;
      continue;
    }
    if (steady && observed && profile && r <= 4 && !wantRes && !wantPred && !wantTrace) {
      // the steady recursion with the mean profiled out, in local scalars up to the next
      // missing hour: the data's state a and the state c of the column of ones (de Jong 1991)
      // follow the same fixed recursion, c_i a_0 + d_i y + a_{i+1} with y = 1 for the ones
      const cd = ws.cd;
      const c0 = cd[0];
      const c1 = cd[1];
      const c2 = cd[2];
      const c3 = cd[3];
      const d0 = cd[4];
      const d1 = cd[5];
      const d2 = cd[6];
      const d3 = cd[7];
      let a0 = a[0];
      let a1 = r > 1 ? a[1] : 0;
      let a2 = r > 2 ? a[2] : 0;
      let a3 = r > 3 ? a[3] : 0;
      let o0 = c[0];
      let o1 = r > 1 ? c[1] : 0;
      let o2 = r > 2 ? c[2] : 0;
      let o3 = r > 3 ? c[3] : 0;
      let svv = 0;
      let sv1 = 0;
      let s11 = 0;
      const end = complete ? n : nextMissing(x, t);
      for (let u = t; u < end; u++) {
        const yu = x[u] - mu0;
        const v = yu - a0;
        const v1 = 1 - o0;
        svv += v * v;
        sv1 += v1 * v;
        s11 += v1 * v1;
        const na0 = c0 * a0 + (d0 * yu + a1);
        a1 = c1 * a0 + (d1 * yu + a2);
        a2 = c2 * a0 + (d2 * yu + a3);
        a3 = c3 * a0 + d3 * yu;
        a0 = na0;
        const no0 = c0 * o0 + (d0 + o1);
        o1 = c1 * o0 + (d1 + o2);
        o2 = c2 * o0 + (d2 + o3);
        o3 = c3 * o0 + d3;
        o0 = no0;
      }
      a[0] = a0;
      c[0] = o0;
      if (r > 1) {
        a[1] = a1;
        c[1] = o1;
      }
      if (r > 2) {
        a[2] = a2;
        c[2] = o2;
      }
      if (r > 3) {
        a[3] = a3;
        c[3] = o3;
      }
      const m = end - t;
      ssq += svv / Fss;
      sxy += sv1 / Fss;
      sxx += s11 / Fss;
      sumLogF += m * logFss;
      nUsed += m;
      t = end - 1;
      continue;
    }
    if (steady && observed && r <= 4 && !profile && !wantTrace && (wantRes || wantPred)) {
      // the final pass's steady stretch in scalars (see steadyStretchWithOutputs), to the next
      // missing hour; P stays the steady covariance, so only the state is written back
      const st = ws.st;
      for (let i = 0; i < 4; i++) st[i] = i < r ? a[i] : 0;
      const end = complete ? n : nextMissing(x, t);
      const sv = steadyStretchWithOutputs(x, t, end, mu0, st, ws.cd, 1 / Math.sqrt(Fss), res, pred);
      for (let i = 0; i < r; i++) a[i] = st[i];
      const m = end - t;
      ssq += sv / Fss;
      sumLogF += m * logFss;
      nUsed += m;
      t = end - 1;
      continue;
    }
    if (steady && observed) {
      if (wantTrace) tr[t] = a[0];
      if (wantOnes) tr1[t] = c[0];
      const v = yt - a[0];
      const vf = v / Fss;
      ssq += v * vf;
      sumLogF += logFss;
      nUsed++;
      if (wantRes) res[t] = v / Math.sqrt(Fss);
      // a ← T (a + K v), in place (a[i + 1] is read before it is overwritten)
      const af0 = a[0] + K[0] * v;
      for (let i = 0; i < r; i++) a[i] = phi[i] * af0 + a[i + 1] + K[i + 1] * v;
      if (profile) {
        const v1 = 1 - c[0];
        sxy += v1 * vf;
        sxx += (v1 * v1) / Fss;
        const cf0 = c[0] + K[0] * v1;
        for (let i = 0; i < r; i++) c[i] = phi[i] * cf0 + c[i + 1] + K[i + 1] * v1;
      }
      continue;
    }
    if (steady && lowRankGaps) {
      // a missing hour after the steady state, a large state: the covariance as the steady one
      // plus a low-rank deviation until the filter is steady again (steady-gap.ts)
      const sums = ws.gapSums;
      sums[0] = ssq;
      sums[1] = sumLogF;
      sums[2] = nUsed;
      sums[3] = sxy;
      sums[4] = sxx;
      const next = filterThroughGaps(x, t, mu0, r, phi, R, P, a, c, profile, res, pred, tol, gapRank, !!opts.keepState, sums, null, 0);
      ssq = sums[0];
      sumLogF = sums[1];
      nUsed = sums[2];
      sxy = sums[3];
      sxx = sums[4];
      if (sums[5] !== GAP_STEADY) {
        // handed over (P is the whole covariance of hour `next`, which the full recursion runs)
        // or at the end
        steady = false;
        chandra = false;
      }
      t = next - 1;
      continue;
    }
    let ginv = 0; // 1/F when observed (the update's rank-one term), 0 when missing
    const p00 = P[0];
    if (observed) {
      const F = p00;
      ginv = 1 / F;
      const v = yt - a[0];
      const vf = v * ginv;
      ssq += v * vf;
      // Σ log F as the log of products of four: a logarithm costs more than the rest of the
      // step here, and F ≥ 1 (it includes the unit innovation variance), so nothing underflows
      prodF *= F;
      if (++inProd === 4) {
        sumLogF += Math.log(prodF);
        prodF = 1;
        inProd = 0;
      }
      nUsed++;
      if (wantRes) res[t] = v / Math.sqrt(F);
      const af0 = a[0] + p00 * vf;
      for (let i = 0; i < r; i++) a[i] = phi[i] * af0 + a[i + 1] + P[i + 1] * vf;
      if (profile) {
        const v1 = 1 - c[0];
        sxy += v1 * vf;
        sxx += v1 * v1 * ginv;
        const v1f = v1 * ginv;
        const cf0 = c[0] + p00 * v1f;
        for (let i = 0; i < r; i++) c[i] = phi[i] * cf0 + c[i + 1] + P[i + 1] * v1f;
      }
    } else {
      if (wantRes) res[t] = NaN;
      // a ← T a
      const a0 = a[0];
      for (let i = 0; i < r; i++) a[i] = phi[i] * a0 + a[i + 1];
      if (profile) {
        const c0 = c[0];
        for (let i = 0; i < r; i++) c[i] = phi[i] * c0 + c[i + 1];
      }
      steady = false;
    }
    let change: number;
    if (chandra && observed) {
      // w_{t+1} = T (w_t − P_t Z' (Z w_t) / F_t), P_{t+1} = P_t + m_t w_t w_t',
      // m_{t+1} = m_t − m_t² (Z w_t)² / F_{t+1}
      const zw = w[0];
      const coef = zw * ginv;
      const e0 = w[0] - P[0] * coef;
      for (let i = 0; i < r; i++) wn[i] = phi[i] * e0 + (w[i + 1] - P[i + 1] * coef);
      let wmax = 0;
      if (trackP) {
        for (let i = 0; i < r; i++) {
          const mwi = mw * w[i];
          const row = i * s;
          for (let j = i; j < r; j++) P[row + j] += mwi * w[j];
          if (w[i] * w[i] > wmax) wmax = w[i] * w[i];
        }
      } else {
        const mz = mw * zw;
        for (let j = 0; j < r; j++) {
          P[j] += mz * w[j];
          if (w[j] * w[j] > wmax) wmax = w[j] * w[j];
        }
      }
      change = Math.abs(mw) * wmax;
      mw -= (mw * mw * zw * zw) / P[0];
      const tmpW = w;
      w = wn;
      wn = tmpW;
    } else {
      chandra = false;
      change = r <= 4 ? riccatiStepSmall(P, Pn, RR, phi, r, p00, ginv) : riccatiStep(P, Pn, RR, phi, g, r, p00, ginv);
      const tmp = P;
      P = Pn;
      Pn = tmp;
    }
    if (inProd > 0 && (t === stopAt || (observed && change < tol))) {
      sumLogF += Math.log(prodF);
      prodF = 1;
      inProd = 0;
    }
    if (t === stopAt) return { ssq, sumLogF, nUsed, mean: mu0, steadyAt: -1, entry: entryOf(t, ssq, sumLogF, a, P, r) };
    if (observed && change < tol && stopAt < 0) {
      if (wantTrace && !entry) entry = wantOnes ? entryWithOnes(t, ssq, sumLogF, a, P, r, c, sxy, sxx) : entryOf(t, ssq, sumLogF, a, P, r);
      chandra = false;
      steady = true;
      steadyAt = t;
      Fss = P[0];
      logFss = Math.log(Fss);
      steadyConstants(P, phi, r, K, ws.cd);
    }
  }
  if (inProd > 0) sumLogF += Math.log(prodF);
  let mean = mu0;
  if (profile && sxx > 0) {
    const beta = sxy / sxx;
    ssq -= beta * sxy;
    mean = beta;
  }
  const out: FilterResult = { ssq, sumLogF, nUsed, mean, steadyAt, entry };
  if (opts.keepState) {
    const aOut = new Float64Array(r);
    for (let i = 0; i < r; i++) aOut[i] = a[i] - (profile ? mean * c[i] : 0);
    out.aPred = aOut;
    const POut = new Float64Array(r * r);
    for (let i = 0; i < r; i++) {
      for (let j = i; j < r; j++) {
        POut[i * r + j] = P[i * s + j];
        POut[j * r + i] = P[i * s + j];
      }
    }
    out.PPred = POut;
  }
  return out;
}

function entryWithOnes(t: number, ssq: number, sumLogF: number, a: Float64Array, P: Float64Array, r: number, c: Float64Array, sxy: number, sxx: number): SteadyEntry {
  const e = entryOf(t, ssq, sumLogF, a, P, r);
  e.ones = { c: Float64Array.from(c.subarray(0, r)), sxy, sxx };
  return e;
}

function entryOf(t: number, ssq: number, sumLogF: number, a: Float64Array, P: Float64Array, r: number): SteadyEntry {
  const aOut = new Float64Array(r);
  const gain = new Float64Array(r);
  for (let i = 0; i < r; i++) {
    aOut[i] = a[i];
    gain[i] = P[i] / P[0];
  }
  return { steadyAt: t, ssq, sumLogF, a: aOut, gain, F: P[0] };
}

/** Exact Gaussian log-likelihood with σ² concentrated out. */
export function concentratedLogLik(f: FilterResult): number {
  const n = f.nUsed;
  const s2 = f.ssq / n;
  return -0.5 * (n * Math.log(2 * Math.PI * s2) + f.sumLogF + n);
}

/**
 * riccatiStep for a state of at most 4 (the orders p, q ≤ 3 without a seasonal block), its ten
 * elements in scalars, zero beyond r: after a missing hour with an MA part near the unit circle
 * the covariance moves for the rest of the series, and the loops over arrays were most of such a
 * pass. (T P T')ᵢⱼ − gᵢgⱼ/F + RᵢRⱼ with gᵢ = φᵢP₀₀ + P₀,ᵢ₊₁, as there.
 */
function riccatiStepSmall(P: Float64Array, Pn: Float64Array, RR: Float64Array, phi: Float64Array, r: number, p00: number, ginv: number): number {
  const s = r + 1;
  const f0 = phi[0];
  const f1 = r > 1 ? phi[1] : 0;
  const f2 = r > 2 ? phi[2] : 0;
  const f3 = r > 3 ? phi[3] : 0;
  // P's elements beyond r are zero (its padding row and column are, the rest is not read)
  const p01 = r > 1 ? P[1] : 0;
  const p02 = r > 2 ? P[2] : 0;
  const p03 = r > 3 ? P[3] : 0;
  const p11 = r > 1 ? P[s + 1] : 0;
  const p12 = r > 2 ? P[s + 2] : 0;
  const p13 = r > 3 ? P[s + 3] : 0;
  const p22 = r > 2 ? P[2 * s + 2] : 0;
  const p23 = r > 3 ? P[2 * s + 3] : 0;
  const p33 = r > 3 ? P[3 * s + 3] : 0;
  const g0 = f0 * p00 + p01;
  const g1 = f1 * p00 + p02;
  const g2 = f2 * p00 + p03;
  const g3 = f3 * p00;
  const h0 = g0 * ginv;
  const h1 = g1 * ginv;
  const h2 = g2 * ginv;
  const h3 = g3 * ginv;
  const n00 = f0 * g0 + f0 * p01 + p11 + RR[0] - h0 * g0;
  Pn[0] = n00;
  let change = Math.abs(n00 - p00);
  if (r > 1) {
    const n01 = f0 * g1 + f1 * p01 + p12 + RR[1] - h0 * g1;
    const n11 = f1 * g1 + f1 * p02 + p22 + RR[s + 1] - h1 * g1;
    Pn[1] = n01;
    Pn[s + 1] = n11;
    change = Math.max(change, Math.abs(n01 - p01), Math.abs(n11 - p11));
  }
  if (r > 2) {
    const n02 = f0 * g2 + f2 * p01 + p13 + RR[2] - h0 * g2;
    const n12 = f1 * g2 + f2 * p02 + p23 + RR[s + 2] - h1 * g2;
    const n22 = f2 * g2 + f2 * p03 + p33 + RR[2 * s + 2] - h2 * g2;
    Pn[2] = n02;
    Pn[s + 2] = n12;
    Pn[2 * s + 2] = n22;
    change = Math.max(change, Math.abs(n02 - p02), Math.abs(n12 - p12), Math.abs(n22 - p22));
  }
  if (r > 3) {
    const n03 = f0 * g3 + f3 * p01 + RR[3] - h0 * g3;
    const n13 = f1 * g3 + f3 * p02 + RR[s + 3] - h1 * g3;
    const n23 = f2 * g3 + f3 * p03 + RR[2 * s + 3] - h2 * g3;
    const n33 = f3 * g3 + RR[3 * s + 3] - h3 * g3;
    Pn[3] = n03;
    Pn[s + 3] = n13;
    Pn[2 * s + 3] = n23;
    Pn[3 * s + 3] = n33;
    change = Math.max(change, Math.abs(n03 - p03), Math.abs(n13 - p13), Math.abs(n23 - p23), Math.abs(n33 - p33));
  }
  return change;
}

/**
 * One step of the full Riccati recursion on the padded upper triangle:
 * P ← T (P − P[·,0] P[0,·]/F) T' + R R' = T P T' − g g'/F + R R', g = T P[·,0] (ginv = 1/F, or 0
 * for a missing hour). Writes Pn; returns the largest change of an element.
 */
function riccatiStep(P: Float64Array, Pn: Float64Array, RR: Float64Array, phi: Float64Array, g: Float64Array, r: number, p00: number, ginv: number): number {
  const s = r + 1;
  for (let i = 0; i < r; i++) g[i] = phi[i] * p00 + P[i + 1];
  let change = 0;
  for (let i = 0; i < r; i++) {
    const phii = phi[i];
    const p0i = P[i + 1];
    const gi = g[i] * ginv;
    const rowN = i * s;
    const rowP = (i + 1) * s + 1;
    for (let j = i; j < r; j++) {
      const phij = phi[j];
      const v = phii * (phij * p00 + P[j + 1]) + phij * p0i + P[rowP + j] + RR[rowN + j] - gi * g[j];
      Pn[rowN + j] = v;
      const d = v - P[rowN + j];
      if (d > change) change = d;
      else if (-d > change) change = -d;
    }
  }
  return change;
}

/** Index of the first missing value at or after `from` (x.length when there is none). */
function nextMissing(x: Float64Array, from: number): number {
  for (let t = from; t < x.length; t++) if (!(x[t] === x[t])) return t;
  return x.length;
}

/** How many values of x[from, to) are missing. */
function missingWithin(x: Float64Array, from: number, to: number): number {
  let count = 0;
  for (let t = from; t < Math.min(to, x.length); t++) if (!(x[t] === x[t])) count++;
  return count;
}

function hasMissing(x: Float64Array): boolean {
  for (let t = 0; t < x.length; t++) if (!(x[t] === x[t])) return true;
  return false;
}
