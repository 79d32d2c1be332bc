import { simulateArma21 } from '../cli/bench-series';
import { denseFilter } from './dense-filter.testing';
import { gapScore } from './gap-score';
import { Orders, stateSpaceWithTangents } from './state-space-tangents';

/**
 * The exact gradient through missing hours against central differences of the objective the
 * fit minimises, −log L / N up to a constant (σ² concentrated out), computed by the dense
 * textbook Kalman filter (dense-filter.testing.ts; Durbin & Koopman 2012, §4.10): nothing of
 * gap-score.ts. Central differences with h = 1e-5 are good to about 1e-9 here.
 */
const objective = (x: Float64Array, u: Float64Array, o: Orders, naturalMa = false): number => {
  const ss = stateSpaceWithTangents(u, o, naturalMa).ss;
  const f = denseFilter(x, ss, 0);
  const n = x.reduce((c, v) => (Number.isNaN(v) ? c : c + 1), 0);
  return -f.logLik / n;
};

const centralDifferences = (x: Float64Array, u: Float64Array, o: Orders, naturalMa = false): number[] => {
  const h = 1e-5;
  return Array.from(u, (_, i) => {
    const up = Float64Array.from(u);
    const down = Float64Array.from(u);
    up[i] += h;
    down[i] -= h;
    return (objective(x, up, o, naturalMa) - objective(x, down, o, naturalMa)) / (2 * h);
  });
};

const series = (n: number, seed: number, missing: number[]): Float64Array => {
  const y = Float64Array.from(simulateArma21(n, seed));
  for (const t of missing) y[t] = NaN;
  return y;
};

const range = (from: number, to: number): number[] => Array.from({ length: to - from }, (_, i) => from + i);

describe('gapScore: the exact gradient of the likelihood through missing hours', () => {
  const isolated = [17, 58, 203, 371];
  const runs = [...range(0, 3), ...range(120, 127), 250, ...range(396, 400)];
  const cases: Array<[string, Orders, number[], number[], boolean]> = [
    ['ARMA(1,1), isolated hours', { p: 1, q: 1, P: 0, Q: 0, period: 0 }, [0.6, -0.4], isolated, false],
    ['ARMA(3,3), a run, the first and the last hours', { p: 3, q: 3, P: 0, Q: 0, period: 0 }, [0.5, -0.2, 0.1, 0.8, 0.3, -0.1], runs, false],
    ['ARMA(3,3) with an MA root near the unit circle', { p: 3, q: 3, P: 0, Q: 0, period: 0 }, [0.9, 0.2, -0.3, 2.5, -0.4, 0.6], [...isolated, ...range(300, 305)], false],
    ['ARMA(2,1)×(1,1)₄ (a state of 6)', { p: 2, q: 1, P: 1, Q: 1, period: 4 }, [0.3, 0.2, -0.5, 0.4, 0.7], runs, false],
    ['ARMA(1,2) with its MA coefficients as they are, outside the invertible region', { p: 1, q: 2, P: 0, Q: 0, period: 0 }, [0.4, 1.6, 0.9], isolated, true],
  ];
  it.each(cases)('%s: within 1e-6 of central differences', (_, o, uv, missing, naturalMa) => {
    const x = series(400, 5, missing);
    const u = Float64Array.from(uv);
    const g = gapScore(x, stateSpaceWithTangents(u, o, naturalMa), u.length);
    expect(g).not.toBeNull();
    const expected = centralDifferences(x, u, o, naturalMa);
    const scale = Math.max(...expected.map(Math.abs));
    expect(scale).toBeGreaterThan(1e-3);
    for (let i = 0; i < u.length; i++) expect(Math.abs(g![i] - expected[i])).toBeLessThan(1e-6 * scale + 1e-9);
  });

  it('gives the gradient of a complete series too', () => {
    const x = series(300, 9, []);
    const o = { p: 2, q: 2, P: 0, Q: 0, period: 0 };
    const u = Float64Array.from([0.4, 0.1, -0.6, 0.2]);
    const g = gapScore(x, stateSpaceWithTangents(u, o), 4)!;
    const expected = centralDifferences(x, u, o);
    for (let i = 0; i < 4; i++) expect(Math.abs(g[i] - expected[i])).toBeLessThan(1e-6 * Math.max(...expected.map(Math.abs)));
  });

  it.each([
    ['ARMA(1,1)×(0,1)_24', { p: 1, q: 1, P: 0, Q: 1, period: 24 }, [0.3, 0.2, -0.6]],
    ['ARMA(1,1)×(1,1)_24', { p: 1, q: 1, P: 1, Q: 1, period: 24 }, [0.3, 0.2, 1.1, -0.6]],
  ])('gives it for %s (a state of 26, beyond Gardner’s system: the start’s adjoint by the doubling algorithm)', (_, o, uv) => {
    const x = series(400, 3, [...isolated, ...range(60, 63)]);
    const u = Float64Array.from(uv as number[]);
    const g = gapScore(x, stateSpaceWithTangents(u, o as Orders), u.length);
    expect(g).not.toBeNull();
    const expected = centralDifferences(x, u, o as Orders);
    const scale = Math.max(...expected.map(Math.abs));
    for (let i = 0; i < u.length; i++) expect(Math.abs(g![i] - expected[i])).toBeLessThan(1e-6 * scale + 1e-9);
  });
});
