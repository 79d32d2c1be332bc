import { ArmaStateSpace, stationaryCovariance } from './state-space';

/**
 * The textbook Kalman filter with dense matrices, as the reference: prediction and update of
 * the state and its whole covariance every hour, a missing observation skipping the update
 * (Durbin & Koopman 2012, §4.3 and §4.10), the stationary covariance as the start, the log
 * likelihood with σ² concentrated out (Harvey 1989, §3.4). O(r³) an hour, nothing of kalman.ts
 * or steady-gap.ts but the stationary start.
 */
export function denseFilter(x: Float64Array, ss: ArmaStateSpace, mean: number) {
  const r = ss.r;
  const P0 = stationaryCovariance(ss);
  let P: number[][] = Array.from({ length: r }, (_, i) => Array.from({ length: r }, (_, j) => P0[i * r + j]));
  let a = new Array<number>(r).fill(0);
  const T = (v: number[]) => v.map((_, i) => ss.phi[i] * v[0] + (i + 1 < r ? v[i + 1] : 0));
  const residuals = new Float64Array(x.length);
  const predictions = new Float64Array(x.length);
  let ssq = 0;
  let sumLogF = 0;
  let nUsed = 0;
  for (let t = 0; t < x.length; t++) {
    predictions[t] = a[0] + mean;
    const y = x[t] - mean;
    if (Number.isNaN(y)) residuals[t] = NaN;
    else {
      const F = P[0][0];
      const v = y - a[0];
      ssq += (v * v) / F;
      sumLogF += Math.log(F);
      nUsed++;
      residuals[t] = v / Math.sqrt(F);
      const p = P.map((row) => row[0]);
      a = a.map((ai, i) => ai + (p[i] * v) / F);
      P = P.map((row, i) => row.map((pij, j) => pij - (p[i] * p[j]) / F));
    }
    a = T(a);
    // T P T' + R R': T applied to the columns, then to the rows
    const TP = P[0].map((_, j) => T(P.map((row) => row[j])));
    const TPT = TP.map((_, i) => T(TP.map((col) => col[i])));
    P = TPT.map((row, i) => row.map((v, j) => v + ss.R[i] * ss.R[j]));
  }
  const n = nUsed;
  const logLik = -0.5 * (n * Math.log((2 * Math.PI * ssq) / n) + sumLogF + n);
  return { logLik, residuals, predictions, a, P };
}
