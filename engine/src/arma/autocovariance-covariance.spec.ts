/**
 * The stationary state covariance from autocovariances against R 4.2.2
 * `makeARIMA(phi, theta, Delta = numeric(0))$Pn` (Gardner, Harvey & Phillips 1980, solved by R)
 * and against the doubling sum (doubling-covariance.ts) on random seasonal models.
 * R script (values below printed with digits = 15):
 *   ar <- c(0.5, 0.2); sar <- 0.6; ma <- 0.4; sma <- -0.5
 *   phi <- c(ar, rep(0, 21), sar, -ar*sar); theta <- c(ma, rep(0, 22), sma, ma*sma)
 *   P <- makeARIMA(phi, theta, Delta = numeric(0))$Pn
 */
import { autocovarianceCovariance } from './autocovariance-covariance';
import { doublingCovariance } from './doubling-covariance';
import { expandAr, expandMa } from './polynomials';
import { armaStateSpace } from './state-space';

describe('autocovarianceCovariance', () => {
  it('matches R makeARIMA for ARMA(2,1)×(1,1)_24', () => {
    const ss = armaStateSpace(expandAr([0.5, 0.2], [0.6], 24), expandMa([0.4], [-0.5], 24));
    expect(ss.r).toBe(26);
    const P = autocovarianceCovariance(ss.r, ss.phi, ss.R)!;
    const at = (i: number, j: number) => P[(i - 1) * ss.r + (j - 1)]; // R's 1-based indices
    expect(at(1, 1)).toBeCloseTo(2.88290191106667, 10);
    expect(at(2, 2)).toBeCloseTo(0.293606677365972, 10);
    expect(at(1, 2)).toBeCloseTo(0.868569755934031, 10);
    expect(at(2, 1)).toBeCloseTo(0.868569755934031, 10);
    expect(at(24, 25)).toBeCloseTo(-0.0699410334928678, 10);
    expect(at(26, 26)).toBeCloseTo(0.08151378751936, 10);
    expect(at(5, 9)).toBeCloseTo(0, 10);
  });

  it('agrees with the doubling sum on seasonal models near and far from the unit circle', () => {
    let seed = 7;
    const rnd = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31) * 2 - 1;
    for (let trial = 0; trial < 40; trial++) {
      const p = trial % 4;
      const q = (trial >> 2) % 3;
      // AR roots kept inside the region by small coefficients; the seasonal ones up to ±0.97
      const ar = Array.from({ length: p }, () => 0.45 * rnd());
      const ma = Array.from({ length: q }, () => 0.9 * rnd());
      const sar = [0.97 * rnd()];
      const sma = [0.95 * rnd()];
      const ss = armaStateSpace(expandAr(ar, sar, 24), expandMa(ma, sma, 24));
      const a = autocovarianceCovariance(ss.r, ss.phi, ss.R)!;
      const b = doublingCovariance(ss.r, ss.phi, ss.R);
      const scale = b[0];
      for (let i = 0; i < a.length; i++) expect(Math.abs(a[i] - b[i]) / scale).toBeLessThan(1e-9);
    }
  });
});
