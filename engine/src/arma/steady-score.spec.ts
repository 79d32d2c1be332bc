import { simulateArma21 } from '../cli/bench-series';
import { kalmanFilter } from './kalman';
import { expandAr, expandMa } from './polynomials';
import { armaStateSpace, ArmaStateSpace } from './state-space';
import { stateSpaceWithTangents } from './state-space-tangents';
import { steadyStateScore } from './steady-score';
import { toInvertible, toStationary } from './transform';

/**
 * The steady-state score is a rewriting of the gradient, so it is checked against the plain
 * definition: central differences of the same objective, ½ log(S/n) + ½ Σ log F_t / n, with
 * the filter run in full at each probe.
 */
describe('steadyStateScore: the gradient of the concentrated likelihood', () => {
  const y = Float64Array.from(simulateArma21(1500, 17));
  const cases: Array<{ name: string; p: number; q: number; P: number; Q: number; s: number; u: number[] }> = [
    { name: 'ARMA(3,3)', p: 3, q: 3, P: 0, Q: 0, s: 1, u: [0.5, -0.3, 0.2, 0.4, 0.1, -0.2] },
    { name: 'ARMA(2,2) near a unit MA root', p: 2, q: 2, P: 0, Q: 0, s: 1, u: [0.3, 0.2, 1.6, 0.3] },
    { name: 'ARMA(1,2)', p: 1, q: 2, P: 0, Q: 0, s: 1, u: [0.6, 0.3, -0.4] },
    { name: 'ARMA(4,1), four states all moving (the general adjoint)', p: 4, q: 1, P: 0, Q: 0, s: 1, u: [0.5, -0.3, 0.2, 0.1, 0.4] },
    { name: 'ARMA(1,1)(0,1)_24, five states and more', p: 1, q: 1, P: 0, Q: 1, s: 24, u: [0.5, 0.3, -0.6] },
  ];

  it.each(cases)('$name: within 1e-6 of central differences', ({ p, q, P, Q, s, u }) => {
    const model = (v: Float64Array): ArmaStateSpace => {
      const ar = toStationary(v.subarray(0, p));
      const ma = toInvertible(v.subarray(p, p + q));
      const sar = toStationary(v.subarray(p + q, p + q + P));
      const sma = toInvertible(v.subarray(p + q + P));
      return armaStateSpace(expandAr(ar, sar, s), expandMa(ma, sma, s));
    };
    const objective = (v: Float64Array): number => {
      const f = kalmanFilter(y, model(v), { tol: 1e-10, complete: true });
      return 0.5 * Math.log(f.ssq / f.nUsed) + (0.5 * f.sumLogF) / f.nUsed;
    };
    const at = Float64Array.from(u);
    const trace = new Float64Array(y.length);
    const pass = kalmanFilter(y, model(at), { tol: 1e-10, complete: true, trace });
    expect(pass.entry).toBeDefined();
    const g = steadyStateScore({ x: y, model: (v) => stateSpaceWithTangents(v, { p, q, P, Q, period: s }) }, at, { ssq: pass.ssq, entry: pass.entry!, trace });
    expect(g).not.toBeNull();
    for (let j = 0; j < at.length; j++) {
      const h = 1e-5;
      const up = Float64Array.from(at);
      const down = Float64Array.from(at);
      up[j] += h;
      down[j] -= h;
      const central = (objective(up) - objective(down)) / (2 * h);
      expect(Math.abs(g![j] - central)).toBeLessThan(1e-6);
    }
  });

  it.each([
    ['ARMA(3,3)', 3, 3, [0.5, -0.3, 0.2, 0.4, 0.1, -0.2]],
    ['ARMA(2,1) near a unit AR root', 2, 1, [2.5, -0.4, 0.3]],
  ])('%s with the mean profiled out: the score at the mean held at its GLS estimate (envelope theorem) matches central differences of the profiled objective', (_n, p, q, u) => {
    // the series far from a zero mean (sunspot-like level of 500), as a fit with a mean sees it
    const x = Float64Array.from(y, (v) => v + 500);
    const model = (v: Float64Array): ArmaStateSpace => armaStateSpace(toStationary(v.subarray(0, p)), toInvertible(v.subarray(p, p + q)));
    const profiled = (v: Float64Array): number => {
      const f = kalmanFilter(x, model(v), { tol: 1e-10, complete: true, profileMean: true });
      return 0.5 * Math.log(f.ssq / f.nUsed) + (0.5 * f.sumLogF) / f.nUsed;
    };
    const at = Float64Array.from(u);
    const mean = kalmanFilter(x, model(at), { tol: 1e-10, complete: true, profileMean: true }).mean;
    expect(Math.abs(mean - 500)).toBeLessThan(5);
    const centred = Float64Array.from(x, (v) => v - mean);
    const trace = new Float64Array(x.length);
    const pass = kalmanFilter(centred, model(at), { tol: 1e-10, complete: true, trace });
    const g = steadyStateScore({ x: centred, model: (v) => stateSpaceWithTangents(v, { p, q, P: 0, Q: 0, period: 0 }) }, at, { ssq: pass.ssq, entry: pass.entry!, trace });
    expect(g).not.toBeNull();
    // The profiled pass runs the general recursions (the column of ones beside the data) and
    // switches to the steady state at another hour than the plain one: its value differs from
    // the plain pass's at the same mean by about 1e-9, which differences over a step of 1e-3
    // turn into a few 1e-6. The gradients are of order 0.1 to 1.
    const plainAt = kalmanFilter(centred, model(at), { tol: 1e-10, complete: true });
    expect(Math.abs(profiled(at) - (0.5 * Math.log(plainAt.ssq / plainAt.nUsed) + (0.5 * plainAt.sumLogF) / plainAt.nUsed))).toBeLessThan(1e-8);
    for (let j = 0; j < at.length; j++) {
      const h = 1e-3;
      const up = Float64Array.from(at);
      const down = Float64Array.from(at);
      up[j] += h;
      down[j] -= h;
      expect(Math.abs(g![j] - (profiled(up) - profiled(down)) / (2 * h))).toBeLessThan(5e-6);
    }
  });

  describe('a late steady state', () => {
    const model = (v: Float64Array): ArmaStateSpace => armaStateSpace(toStationary(v.subarray(0, 2)), toInvertible(v.subarray(2)));
    const tangents = (v: Float64Array) => stateSpaceWithTangents(v, { p: 2, q: 2, P: 0, Q: 0, period: 0 });
    const objective = (v: Float64Array): number => {
      const f = kalmanFilter(y, model(v), { tol: 1e-10, complete: true });
      return 0.5 * Math.log(f.ssq / f.nUsed) + (0.5 * f.sumLogF) / f.nUsed;
    };
    const scoreAt = (at: Float64Array) => {
      const trace = new Float64Array(y.length);
      const pass = kalmanFilter(y, model(at), { tol: 1e-10, complete: true, trace });
      return { steadyAt: pass.entry?.steadyAt ?? -1, g: pass.entry ? steadyStateScore({ x: y, model: tangents }, at, { ssq: pass.ssq, entry: pass.entry, trace }) : null };
    };

    it('is still scored past half the series (cheaper than k differenced passes through the same start-up)', () => {
      // an MA root this close to the unit circle keeps the gain moving for over half the series
      const at = Float64Array.from([0.3, 0.2, 2.2, 0.5]);
      const { steadyAt, g } = scoreAt(at);
      expect(steadyAt).toBeGreaterThan(y.length / 2);
      expect(g).not.toBeNull();
      for (let j = 0; j < at.length; j++) {
        const h = 1e-5;
        const up = Float64Array.from(at);
        const down = Float64Array.from(at);
        up[j] += h;
        down[j] -= h;
        expect(Math.abs(g![j] - (objective(up) - objective(down)) / (2 * h))).toBeLessThan(1e-6);
      }
    });

    it('is declined past 3n/k hours of start-up (the caller then takes the Chandrasekhar score)', () => {
      const { steadyAt, g } = scoreAt(Float64Array.from([0.3, 0.2, 2.45, 0.5]));
      expect(steadyAt).toBeGreaterThan((3 * y.length) / 4);
      expect(g).toBeNull();
    });
  });

  it('the state-space derivatives match differences of the transform, seasonal product included', () => {
    const o = { p: 2, q: 1, P: 1, Q: 1, period: 24 };
    const u = [0.4, -0.3, 0.5, 0.7, -0.6];
    const { ss, dPhi, dR } = stateSpaceWithTangents(Float64Array.from(u), o);
    const h = 1e-6;
    for (let j = 0; j < u.length; j++) {
      const up = u.slice();
      const down = u.slice();
      up[j] += h;
      down[j] -= h;
      const a = stateSpaceWithTangents(Float64Array.from(up), o).ss;
      const b = stateSpaceWithTangents(Float64Array.from(down), o).ss;
      for (let i = 0; i < ss.r; i++) {
        expect(dPhi[j * ss.r + i]).toBeCloseTo((a.phi[i] - b.phi[i]) / (2 * h), 7);
        expect(dR[j * ss.r + i]).toBeCloseTo((a.R[i] - b.R[i]) / (2 * h), 7);
      }
    }
  });
});
