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
import { ArmaStateSpace, stationaryCovariance } from './state-space';

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
}

export function kalmanFilter(x: ArrayLike<number>, ss: ArmaStateSpace, opts: FilterOptions = {}): FilterResult {
  const { r, phi, R } = ss;
  const n = x.length;
  const tol = opts.tol ?? 1e-10;
  const profile = opts.mean === undefined && !!opts.profileMean;
  const mu0 = opts.mean ?? 0;
  let P: Float64Array = stationaryCovariance(ss);
  let Pn: Float64Array = new Float64Array(r * r);
  const Pf = new Float64Array(r * r);
  const a = new Float64Array(r);
  const af = new Float64Array(r);
  const c = new Float64Array(r); // state of the filtered column of ones (profile mean)
  const cf = new Float64Array(r);
  const M = new Float64Array(r);
  const RR = new Float64Array(r * r);
  for (let i = 0; i < r; i++) for (let j = 0; j < r; j++) RR[i * r + j] = R[i] * R[j];
  const K = new Float64Array(r);
  let steady = false;
  let Fss = 0;
  let logFss = 0;
  let steadyAt = -1;
  let ssq = 0;
  let sumLogF = 0;
  let nUsed = 0;
  let sxy = 0;
  let sxx = 0;
  const res = opts.residuals;
  const pred = opts.predictions;
  // innovations for the profile-mean case are stored temporarily to rebuild residuals later
  for (let t = 0; t < n; t++) {
    const yt = x[t] - mu0;
    const observed = yt === yt;
    if (pred) pred[t] = a[0] + mu0;
    if (steady && observed) {
      const v = yt - a[0];
      ssq += (v * v) / Fss;
      sumLogF += logFss;
      nUsed++;
      if (res) res[t] = v / Math.sqrt(Fss);
      for (let i = 0; i < r; i++) af[i] = a[i] + K[i] * v;
      const a0 = af[0];
      for (let i = 0; i < r - 1; i++) a[i] = phi[i] * a0 + af[i + 1];
      a[r - 1] = phi[r - 1] * a0;
      if (profile) {
        const v1 = 1 - c[0];
        sxy += (v * v1) / Fss;
        sxx += (v1 * v1) / Fss;
        for (let i = 0; i < r; i++) cf[i] = c[i] + K[i] * v1;
        const c0 = cf[0];
        for (let i = 0; i < r - 1; i++) c[i] = phi[i] * c0 + cf[i + 1];
        c[r - 1] = phi[r - 1] * c0;
      }
      continue;
    }
    if (observed) {
      const F = P[0];
      const v = yt - a[0];
      ssq += (v * v) / F;
      sumLogF += Math.log(F);
      nUsed++;
      if (res) res[t] = v / Math.sqrt(F);
      for (let i = 0; i < r; i++) M[i] = P[i * r];
      const vf = v / F;
      for (let i = 0; i < r; i++) af[i] = a[i] + M[i] * vf;
      for (let i = 0; i < r; i++) {
        const mi = M[i] / F;
        const row = i * r;
        for (let j = 0; j < r; j++) Pf[row + j] = P[row + j] - mi * M[j];
      }
      if (profile) {
        const v1 = 1 - c[0];
        sxy += (v * v1) / F;
        sxx += (v1 * v1) / F;
        const v1f = v1 / F;
        for (let i = 0; i < r; i++) cf[i] = c[i] + M[i] * v1f;
      }
    } else {
      if (res) res[t] = NaN;
      af.set(a);
      Pf.set(P);
      if (profile) cf.set(c);
      steady = false;
    }
    // prediction step: a = T af, P = T Pf T' + R R'
    const a0 = af[0];
    for (let i = 0; i < r - 1; i++) a[i] = phi[i] * a0 + af[i + 1];
    a[r - 1] = phi[r - 1] * a0;
    if (profile) {
      const c0 = cf[0];
      for (let i = 0; i < r - 1; i++) c[i] = phi[i] * c0 + cf[i + 1];
      c[r - 1] = phi[r - 1] * c0;
    }
    const p00 = Pf[0];
    let change = 0;
    for (let i = 0; i < r; i++) {
      const phii = phi[i];
      const hasI = i + 1 < r;
      for (let j = i; j < r; j++) {
        const phij = phi[j];
        const hasJ = j + 1 < r;
        let s = phii * phij * p00 + RR[i * r + j];
        if (hasJ) s += phii * Pf[j + 1];
        if (hasI) s += phij * Pf[(i + 1) * r];
        if (hasI && hasJ) s += Pf[(i + 1) * r + j + 1];
        Pn[i * r + j] = s;
        Pn[j * r + i] = s;
        const d = Math.abs(s - P[i * r + j]);
        if (d > change) change = d;
      }
    }
    const tmp = P;
    P = Pn;
    Pn = tmp;
    if (observed && change < tol) {
      steady = true;
      steadyAt = t;
      Fss = P[0];
      logFss = Math.log(Fss);
      for (let i = 0; i < r; i++) K[i] = P[i * r] / Fss;
    }
  }
  let mean = mu0;
  if (profile && sxx > 0) {
    const beta = sxy / sxx;
    ssq -= beta * sxy;
    mean = beta;
  }
  const out: FilterResult = { ssq, sumLogF, nUsed, mean, steadyAt };
  if (opts.keepState) {
    const aOut = Float64Array.from(a);
    if (profile) for (let i = 0; i < r; i++) aOut[i] -= mean * c[i];
    out.aPred = aOut;
    out.PPred = Float64Array.from(P);
  }
  return out;
}

/** Exact Gaussian log-likelihood with σ² concentrated out. */
export function concentratedLogLik(f: FilterResult): number {
  const n = f.nUsed;
  const s2 = f.ssq / n;
  return -0.5 * (n * Math.log(2 * Math.PI * s2) + f.sumLogF + n);
}
