import { simulateArma21 } from '../cli/bench-series';
import { concentratedLogLik, kalmanFilter } from './kalman';
import { expandAr, expandMa } from './polynomials';
import { denseFilter } from './dense-filter.testing';
import { ArmaStateSpace, armaStateSpace } from './state-space';

/**
 * A seasonal state (r = 26, the weekly-differenced demand models' size) through missing hours:
 * the filter carries its covariance as the gapless filter's plus a low-rank deviation
 * (steady-gap.ts), from the first missing hour whether or not the filter is steady by then, and
 * hands over to the full recursion where the deviation's rank would pass half the state. Every
 * path against the dense textbook filter (dense-filter.testing.ts).
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
    ['more missing hours than the deviation may hold, never steady (brought down to its numerical rank)', slow, Array.from({ length: 20 }, (_, i) => 100 + 30 * i)],
    ['the same hour of 20 days missing, never steady (brought down to its numerical rank)', slow, Array.from({ length: 20 }, (_, i) => 100 + 24 * i)],
    ['a 16-hour run long after the first missing hour, never steady (handed over, the gapless covariance rebuilt)', slow, [40, ...Array.from({ length: 16 }, (_, i) => 300 + i)]],
    ['a 16-hour run right after the first missing hour, never steady (tracked again from the start)', slow, Array.from({ length: 16 }, (_, i) => 300 + i)],
    ['more missing hours than it may hold after the steady state (handed over)', settles, Array.from({ length: 20 }, (_, i) => 500 + i)],
  ];

  it.each(cases)('%s: the likelihood pass gives the same log-likelihood', (_name, ss, at) => {
    const g = withGaps(at);
    const dense = denseFilter(g, ss, 0);
    const f = kalmanFilter(g, ss);
    expect(f.nUsed).toBe(g.length - at.length);
    expect(Math.abs(concentratedLogLik(f) - dense.logLik)).toBeLessThan(1e-10 * Math.abs(dense.logLik));
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
