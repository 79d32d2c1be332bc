import { simulateArma21 } from '../cli/bench-series';
import { concentratedLogLik, kalmanFilter } from './kalman';
import { expandAr, expandMa } from './polynomials';
import { ArmaStateSpace, armaStateSpace, stationaryCovariance } from './state-space';

/**
 * The textbook Kalman filter with dense matrices, as the reference: prediction and update of
 * the state and its whole covariance every hour, a missing observation skipping the update
 * (Durbin & Koopman 2012, §4.3 and §4.10), the stationary covariance as the start, the log
 * likelihood with σ² concentrated out (Harvey 1989, §3.4). O(r³) an hour, nothing of kalman.ts
 * or steady-gap.ts but the stationary start.
 */
function denseFilter(x: Float64Array, ss: ArmaStateSpace, mean: number) {
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

/**
 * A seasonal state (r = 26, the weekly-differenced demand models' size) through missing hours:
 * the filter carries its covariance as the gapless filter's plus a low-rank deviation
 * (steady-gap.ts), from the first missing hour whether or not the filter is steady by then, and
 * hands over to the full recursion where the deviation's rank would pass half the state. Every
 * path against the dense textbook filter above.
 */
describe('kalmanFilter through missing hours with a large state, against the dense textbook filter', () => {
  const y = Float64Array.from(simulateArma21(900, 17));
  const withGaps = (at: number[]) => {
    const g = Float64Array.from(y);
    for (const t of at) g[t] = NaN;
    return g;
  };
  // the seasonal MA root near the unit circle keeps the filter from settling within the series;
  // the other settles within a few hundred hours
  const slow = armaStateSpace(expandAr([0.5], [0.3], 24), expandMa([0.3], [-0.95], 24));
  const settles = armaStateSpace(expandAr([0.5], [0.6], 24), expandMa([0.3], [-0.5], 24));
  const cases: Array<[string, ArmaStateSpace, number[]]> = [
    ['isolated hours, the filter never steady', slow, [40, 41, 300, 301, 302, 650]],
    ['isolated hours after the steady state', settles, [600, 601, 750]],
    ['an hour before the steady state and some after', settles, [5, 600, 700, 701]],
    ['more missing hours than the deviation may hold, never steady (tracked from the start)', slow, Array.from({ length: 20 }, (_, i) => 100 + 30 * i)],
    ['more missing hours than it may hold after the steady state (handed over)', settles, Array.from({ length: 20 }, (_, i) => 500 + i)],
  ];

  it.each(cases)('%s: the likelihood pass gives the same log-likelihood', (_name, ss, at) => {
    const g = withGaps(at);
    const dense = denseFilter(g, ss, 0);
    const f = kalmanFilter(g, ss);
    expect(f.nUsed).toBe(g.length - at.length);
    expect(Math.abs(concentratedLogLik(f) - dense.logLik)).toBeLessThan(1e-7 * Math.abs(dense.logLik));
  });

  it.each(cases)('%s: the final pass (a known mean) gives the same residuals, predictions and end state', (_name, ss, at) => {
    const g = withGaps(at);
    const dense = denseFilter(g, ss, 0.4);
    const residuals = new Float64Array(g.length);
    const predictions = new Float64Array(g.length);
    const f = kalmanFilter(g, ss, { mean: 0.4, residuals, predictions, keepState: true });
    expect(Math.abs(concentratedLogLik(f) - dense.logLik)).toBeLessThan(1e-7 * Math.abs(dense.logLik));
    for (let t = 0; t < g.length; t++) {
      if (Number.isNaN(g[t])) expect(residuals[t]).toBeNaN();
      else expect(Math.abs(residuals[t] - dense.residuals[t])).toBeLessThan(1e-7);
      expect(Math.abs(predictions[t] - dense.predictions[t])).toBeLessThan(1e-7);
    }
    const r = ss.r;
    for (let i = 0; i < r; i++) expect(Math.abs(f.aPred![i] - dense.a[i])).toBeLessThan(1e-7);
    for (let i = 0; i < r; i++) for (let j = 0; j < r; j++) expect(Math.abs(f.PPred![i * r + j] - dense.P[i][j])).toBeLessThan(1e-7 * dense.P[0][0]);
  });

  it('with the mean profiled out: the GLS mean and likelihood of the dense filter at that mean', () => {
    const g = withGaps([600, 601, 750]);
    const shifted = g.map((v) => v + 3);
    const f = kalmanFilter(shifted, settles, { profileMean: true });
    const dense = denseFilter(shifted, settles, f.mean);
    // the profiled likelihood is the likelihood at the GLS mean, which maximises it: the dense
    // filter a little either side of that mean gives less
    expect(Math.abs(concentratedLogLik(f) - dense.logLik)).toBeLessThan(1e-7 * Math.abs(dense.logLik));
    for (const d of [-0.01, 0.01]) expect(denseFilter(shifted, settles, f.mean + d).logLik).toBeLessThan(dense.logLik);
    expect(Math.abs(f.mean - 3)).toBeLessThan(1);
  });
});
