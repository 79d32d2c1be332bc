/**
 * The doubling sum of the stationary covariance against the two independent routes to the same
 * matrix: Gardner, Harvey & Phillips's linear system (small r) and the term-by-term series.
 */
import { doublingCovariance } from './doubling-covariance';
import { expandAr, expandMa } from './polynomials';
import { armaStateSpace, gardnerCovariance, seriesCovariance } from './state-space';

function maxRelDiff(a: Float64Array, b: Float64Array): number {
  let scale = 0;
  for (const v of b) scale = Math.max(scale, Math.abs(v));
  let d = 0;
  for (let i = 0; i < a.length; i++) d = Math.max(d, Math.abs(a[i] - b[i]));
  return d / scale;
}

describe('stationary covariance by doubling', () => {
  it.each([
    ['ARMA(2,1)', [0.6, -0.2], [0.4]],
    ['ARMA(3,3) near a unit root', [1.5, -0.45, -0.06], [-0.9, 0.2, 0.1]],
    ['AR(1) at 0.999', [0.999], []],
    ['ARMA(1,11)', [0.3], [0.5, 0, 0, 0, 0, 0, 0, 0, 0, 0, -0.4]],
  ])('equals Gardner’s solution: %s', (_n, ar, ma) => {
    const ss = armaStateSpace(ar, ma);
    expect(maxRelDiff(doublingCovariance(ss.r, ss.phi, ss.R), gardnerCovariance(ss))).toBeLessThan(1e-9);
  });

  it('equals the term-by-term series for a seasonal state (r = 26)', () => {
    const ss = armaStateSpace(expandAr([0.5], [0.3], 24), expandMa([0.4], [-0.6], 24));
    expect(ss.r).toBe(26);
    expect(maxRelDiff(doublingCovariance(ss.r, ss.phi, ss.R), seriesCovariance(ss))).toBeLessThan(1e-10);
  });

  it('solves P = T P T′ + R R′ where the series would need a million terms (seasonal AR root 0.9999)', () => {
    const ss = armaStateSpace(expandAr([0.2], [0.9999], 24), expandMa([0.3], [-0.5], 24));
    const { r, phi, R } = ss;
    const P = doublingCovariance(r, phi, R);
    // residual of the Lyapunov equation, (T P T')_ij = φ_i φ_j P_00 + φ_i P_{0,j+1} + φ_j P_{i+1,0} + P_{i+1,j+1}
    let worst = 0;
    for (let i = 0; i < r; i++) {
      for (let j = 0; j < r; j++) {
        let t = phi[i] * phi[j] * P[0];
        if (j + 1 < r) t += phi[i] * P[j + 1];
        if (i + 1 < r) t += phi[j] * P[(i + 1) * r];
        if (i + 1 < r && j + 1 < r) t += P[(i + 1) * r + j + 1];
        worst = Math.max(worst, Math.abs(t + R[i] * R[j] - P[i * r + j]));
      }
    }
    expect(worst / P[0]).toBeLessThan(1e-9);
    expect(P[0]).toBeGreaterThan(1000);
  });
});
