import fc from 'fast-check';
import { armaStateSpace, gardnerCovariance, seriesCovariance, seriesCovarianceTangents, stationaryCovarianceTangents } from './state-space';
import { toInvertible, toStationary } from './transform';

/** A random stationary and invertible ARMA(3,3) through the transform, and a direction. */
const model = fc.tuple(fc.array(fc.double({ min: -1.5, max: 1.5, noNaN: true }), { minLength: 6, maxLength: 6 }), fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: 8, maxLength: 8 }));

describe('stationary covariance: Gardner, Harvey & Phillips against the series form', () => {
  it('the two solutions agree on random stationary ARMA(3,3) models', () => {
    fc.assert(
      fc.property(model, ([u]) => {
        const ss = armaStateSpace(toStationary(u.slice(0, 3)), toInvertible(u.slice(3)));
        const a = gardnerCovariance(ss);
        const b = seriesCovariance(ss);
        for (let i = 0; i < a.length; i++) expect(Math.abs(a[i] - b[i])).toBeLessThan(1e-9 * (1 + Math.abs(b[i])));
      }),
      { numRuns: 200 },
    );
  });

  it('and so do their derivatives, which match differences of the covariance', () => {
    fc.assert(
      fc.property(model, ([u, dir]) => {
        const ss = armaStateSpace(toStationary(u.slice(0, 3)), toInvertible(u.slice(3)));
        const r = ss.r;
        const dPhi = Float64Array.from(dir.slice(0, r));
        const dR = Float64Array.from([0, ...dir.slice(r, r + r - 1)]);
        const g = stationaryCovarianceTangents(ss, dPhi, dR, 1);
        const s = seriesCovarianceTangents(ss, dPhi, dR, 1);
        const h = 1e-6;
        const up = { r, phi: ss.phi.map((v, i) => v + h * dPhi[i]), R: ss.R.map((v, i) => v + h * dR[i]) };
        const down = { r, phi: ss.phi.map((v, i) => v - h * dPhi[i]), R: ss.R.map((v, i) => v - h * dR[i]) };
        const pu = seriesCovariance(up);
        const pd = seriesCovariance(down);
        for (let j = 0; j < r; j++) {
          const central = (pu[j] - pd[j]) / (2 * h);
          const scale = 1 + Math.abs(central);
          expect(Math.abs(g.dRow[j] - s.dRow[j])).toBeLessThan(1e-6 * scale);
          expect(Math.abs(g.dRow[j] - central)).toBeLessThan(1e-4 * scale);
        }
      }),
      { numRuns: 60 },
    );
  });
});
