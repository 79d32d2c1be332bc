/**
 * Property test (fast-check): ARMA parameters of long simulated series are recovered within
 * their standard errors (4 s.e., so a correct estimator fails with negligible probability), and
 * a simulated series with missing values still gives a likelihood over the observed points only.
 */
import fc from 'fast-check';
import { fitArma } from './fit';

function simulate(n: number, ar: number[], ma: number[], mean: number, seed: number): number[] {
  let s = seed >>> 0 || 1;
  const u = () => {
    s ^= s << 13;
    s >>>= 0;
    s ^= s >>> 17;
    s ^= s << 5;
    s >>>= 0;
    return (s + 0.5) / 4294967296;
  };
  const g = () => Math.sqrt(-2 * Math.log(u())) * Math.cos(2 * Math.PI * u());
  const burn = 500;
  const e: number[] = [];
  const x: number[] = [];
  for (let t = 0; t < n + burn; t++) {
    e.push(g());
    let v = e[t];
    ar.forEach((a, i) => (v += t - i - 1 >= 0 ? a * x[t - i - 1] : 0));
    ma.forEach((b, i) => (v += t - i - 1 >= 0 ? b * e[t - i - 1] : 0));
    x.push(v);
  }
  return x.slice(burn).map((v) => v + mean);
}

describe('ARMA recovery on simulated series', () => {
  it('recovers ARMA(1,1) parameters within 5 standard errors', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -0.85, max: 0.85, noNaN: true }),
        fc.double({ min: -0.8, max: 0.8, noNaN: true }),
        fc.integer({ min: 1, max: 1e9 }),
        (phi, theta, seed) => {
          fc.pre(Math.abs(phi + theta) > 0.2); // near-cancelling roots are not identified
          const x = simulate(4000, [phi], [theta], 10, seed);
          const f = fitArma(x, { p: 1, q: 1, includeMean: true });
          const [a, b, m] = f.coefficients;
          // 5 standard errors: the property draws new series on every run (36 comparisons of
          // this kind a run; at 4 one in about 400 runs failed by chance alone)
          expect(Math.abs(a.value - phi)).toBeLessThan(5 * a.se);
          expect(Math.abs(b.value - theta)).toBeLessThan(5 * b.se);
          expect(Math.abs(m.value - 10)).toBeLessThan(5 * m.se);
          // σ̂² of 4,000 unit-variance innovations has s.d. √(2/4000) = 0.022: 0.12 is 5.4 of them
          expect(Math.abs(f.sigma2 - 1)).toBeLessThan(0.12);
        },
      ),
      { numRuns: 12 },
    );
  });
  it('recovers AR(2) with 10 % of the values missing', () => {
    const x = simulate(5000, [0.6, -0.3], [], 0, 99);
    for (let i = 0; i < x.length; i += 10) x[i] = NaN;
    const f = fitArma(x, { p: 2, q: 0, includeMean: false });
    expect(f.nUsed).toBe(4500);
    expect(Math.abs(f.ar[0] - 0.6)).toBeLessThan(4 * f.coefficients[0].se);
    expect(Math.abs(f.ar[1] + 0.3)).toBeLessThan(4 * f.coefficients[1].se);
  });
});
