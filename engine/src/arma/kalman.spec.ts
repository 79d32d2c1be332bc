import { simulateArma21 } from '../cli/bench-series';
import { concentratedLogLik, kalmanFilter } from './kalman';
import { armaStateSpace } from './state-space';

/**
 * A leading missing hour leaves the filter exactly where it starts (the state and its
 * stationary covariance are invariant under one prediction step), so a series and the same
 * series behind one missing hour have the same likelihood. The first takes the Chandrasekhar
 * recursions, the second the full Riccati recursion: this checks one against the other.
 */
describe('kalmanFilter: Chandrasekhar recursions against the full Riccati recursion', () => {
  const y = Float64Array.from(simulateArma21(600, 9));
  const behindGap = Float64Array.from([NaN, ...y]);
  const models: Array<[string, number[], number[]]> = [
    ['AR(1)', [0.7], []],
    ['ARMA(1,1)', [0.6], [0.4]],
    ['ARMA(2,2) near a unit MA root', [0.5, -0.3], [1.6, 0.62]],
    ['ARMA(3,3)', [0.5, -0.3, 0.1], [0.9, 0.5, 0.2]],
  ];
  it.each(models)('%s: same log-likelihood, with and without the steady-state switch', (_name, ar, ma) => {
    const ss = armaStateSpace(ar, ma);
    for (const tol of [1e-10, 0]) {
      const a = kalmanFilter(y, ss, { tol });
      const b = kalmanFilter(behindGap, ss, { tol });
      expect(a.nUsed).toBe(b.nUsed);
      expect(Math.abs(concentratedLogLik(a) - concentratedLogLik(b))).toBeLessThan(1e-8);
    }
  });

  it('keeps the whole covariance when the final state is wanted, and it matches the Riccati one', () => {
    const ss = armaStateSpace([0.5, -0.3, 0.1], [0.9, 0.5, 0.2]);
    const a = kalmanFilter(y, ss, { tol: 0, keepState: true });
    const b = kalmanFilter(behindGap, ss, { tol: 0, keepState: true });
    const pa = a.PPred as Float64Array;
    const pb = b.PPred as Float64Array;
    for (let i = 0; i < pa.length; i++) expect(pa[i]).toBeCloseTo(pb[i], 10);
    const aa = a.aPred as Float64Array;
    const ab = b.aPred as Float64Array;
    for (let i = 0; i < aa.length; i++) expect(aa[i]).toBeCloseTo(ab[i], 10);
  });

  it('hands over to the full recursion at a missing hour in the middle', () => {
    const ss = armaStateSpace([0.6], [0.4]);
    const gap = Float64Array.from(y);
    gap[5] = NaN;
    const behind = Float64Array.from([NaN, ...gap]);
    const a = kalmanFilter(gap, ss, { tol: 0 });
    const b = kalmanFilter(behind, ss, { tol: 0 });
    expect(Math.abs(concentratedLogLik(a) - concentratedLogLik(b))).toBeLessThan(1e-8);
  });
});
