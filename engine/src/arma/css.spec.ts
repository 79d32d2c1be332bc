/**
 * The conditional-sum-of-squares objective's exact gradient (css.ts, smallOrderCss) against
 * central differences of the same objective: the backward (adjoint) pass must give the slope the
 * objective itself shows, on real data (the open demand series, R forecast's `taylor`, daily
 * differenced), with and without missing hours, for every small order the search uses it for
 * and for orders with a seasonal block at 24 (the sparse recursion).
 */
import taylor from '../fixtures/taylor-hourly.json';
import { difference } from '../differencing';
import { minimizeBfgs } from './bfgs';
import { cssStart, generalCss, smallOrderCss } from './css';

const daily = Float64Array.from(difference(taylor.load as number[], [24]));
const mean = daily.reduce((a, b) => a + b, 0) / daily.length;
const centred = daily.map((v) => v - mean);
const withGaps = Float64Array.from(centred);
for (const t of [5, 6, 7, 300, 301, 1200, 1990]) withGaps[t] = NaN;

function centralDifferences(f: (u: Float64Array) => number, u: Float64Array, h = 1e-6): Float64Array {
  const g = new Float64Array(u.length);
  const v = Float64Array.from(u);
  for (let i = 0; i < u.length; i++) {
    v[i] = u[i] + h;
    const up = f(v);
    v[i] = u[i] - h;
    const down = f(v);
    v[i] = u[i];
    g[i] = (up - down) / (2 * h);
  }
  return g;
}

const orders: Array<[number, number]> = [
  [0, 1],
  [1, 0],
  [1, 1],
  [2, 2],
  [3, 2],
  [2, 3],
  [3, 3],
];

describe('CSS objective gradient (adjoint pass)', () => {
  it.each(orders)('ARMA(%i,%i) matches central differences, complete and with gaps', (p, q) => {
    for (const x of [centred, withGaps]) {
      const css = smallOrderCss(x, p, q);
      // a point inside the region with every partial autocorrelation away from zero
      const u = Float64Array.from({ length: p + q }, (_, i) => (i % 2 === 0 ? 0.6 : -0.4) + 0.1 * i);
      const numeric = centralDifferences(css.objective, u);
      css.objective(u);
      const exact = css.gradient(u) as Float64Array;
      expect(exact).not.toBeNull();
      for (let i = 0; i < u.length; i++) expect(Math.abs(exact[i] - numeric[i])).toBeLessThan(1e-6 * Math.max(1, Math.abs(numeric[i])));
    }
  });

  const seasonal: Array<[number, number, number, number]> = [
    [0, 0, 1, 1],
    [1, 1, 1, 1],
    [3, 3, 1, 1],
    [2, 0, 1, 0],
    [0, 2, 0, 1],
    [4, 1, 0, 0],
  ];
  it.each(seasonal)('ARMA(%i,%i)×(%i,%i)_24 matches central differences, complete and with gaps', (p, q, P, Q) => {
    for (const x of [centred, withGaps]) {
      const css = generalCss(x, { p, q, P, Q, period: 24 });
      const k = p + q + P + Q;
      const u = Float64Array.from({ length: k }, (_, i) => (i % 2 === 0 ? 0.5 : -0.3) + 0.07 * i);
      const numeric = centralDifferences(css.objective, u);
      css.objective(u);
      const exact = css.gradient(u) as Float64Array;
      for (let i = 0; i < k; i++) expect(Math.abs(exact[i] - numeric[i])).toBeLessThan(1e-6 * Math.max(1, Math.abs(numeric[i])));
    }
  });

  it('gives the gradient at zero, where every expanded coefficient is zero', () => {
    const css = generalCss(centred, { p: 1, q: 1, P: 1, Q: 1, period: 24 });
    const u = new Float64Array(4);
    const numeric = centralDifferences(css.objective, u);
    css.objective(u);
    const exact = css.gradient(u) as Float64Array;
    for (let i = 0; i < 4; i++) expect(Math.abs(exact[i] - numeric[i])).toBeLessThan(1e-6 * Math.max(1, Math.abs(numeric[i])));
    expect(Math.max(...exact.map(Math.abs))).toBeGreaterThan(0.01);
  });

  it('ends the seasonal CSS search where forward differences end it', () => {
    // the same minimum as the search without the gradient, to the precision a start needs
    const o = { p: 1, q: 1, P: 1, Q: 1, period: 24 };
    const exact = cssStart(centred, o) as Float64Array;
    const css = generalCss(centred, o);
    const differenced = minimizeBfgs(css.objective, new Float64Array(4), { maxIter: 100, gradTol: 1e-6, fTol: 1e-10, step: 1e-6 });
    expect(css.objective(exact)).toBeLessThanOrEqual(differenced.f + 1e-8);
    for (let i = 0; i < 4; i++) expect(Math.abs(Math.tanh(exact[i]) - Math.tanh(differenced.x[i]))).toBeLessThan(2e-3);
  });

  it('gives no gradient at a point other than the last evaluation', () => {
    const css = smallOrderCss(centred, 2, 2);
    const u = Float64Array.from([0.3, -0.2, 0.1, 0.4]);
    css.objective(u);
    expect(css.gradient(Float64Array.from([0.3, -0.2, 0.1, 0.41]))).toBeNull();
  });
});
