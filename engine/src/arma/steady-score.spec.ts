import { simulateArma21 } from '../cli/bench-series';
import { kalmanFilter } from './kalman';
import { expandAr, expandMa } from './polynomials';
import { armaStateSpace, ArmaStateSpace } from './state-space';
import { stateSpaceWithTangents } from './state-space-tangents';
import { steadyStateScore } from './steady-score';
import { toInvertible, toStationary } from './transform';

/** Each element of g within tol of the central difference of f at `at` over ±h. */
function expectCentralDifferences(g: Float64Array, f: (v: Float64Array) => number, at: Float64Array, h: number, tol: number): void {
  for (let j = 0; j < at.length; j++) {
    const up = Float64Array.from(at);
    const down = Float64Array.from(at);
    up[j] += h;
    down[j] -= h;
    expect(Math.abs(g[j] - (f(up) - f(down)) / (2 * h))).toBeLessThan(tol);
  }
}

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
    expectCentralDifferences(g!, objective, at, 1e-5, 1e-6);
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
    expectCentralDifferences(g!, profiled, at, 1e-3, 5e-6);
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
      expectCentralDifferences(g!, objective, at, 1e-5, 1e-6);
    });

    it('up to four states, is scored past 3n/k hours of start-up too (the start-up differentiated backwards)', () => {
      const at = Float64Array.from([0.3, 0.2, 2.45, 0.5]);
      const { steadyAt, g } = scoreAt(at);
      expect(steadyAt).toBeGreaterThan((3 * y.length) / 4);
      expect(g).not.toBeNull();
      expectCentralDifferences(g!, objective, at, 1e-5, 1e-6);
    });

    it('with more than four states, past 3n/k hours of start-up too (where forward tangents gave way to the Chandrasekhar score)', () => {
      const o = { p: 2, q: 2, P: 0, Q: 1, period: 24 };
      const seasonal = (v: Float64Array): ArmaStateSpace => armaStateSpace(toStationary(v.subarray(0, 2)), expandMa(toInvertible(v.subarray(2, 4)), toInvertible(v.subarray(4)), 24));
      const at = Float64Array.from([0.3, 0.2, 0.4, 0.1, 1.2]);
      const trace = new Float64Array(y.length);
      const pass = kalmanFilter(y, seasonal(at), { tol: 1e-10, complete: true, trace });
      expect(pass.entry).toBeDefined();
      expect(pass.entry!.steadyAt).toBeGreaterThan((3 * y.length) / 5);
      const g = steadyStateScore({ x: y, model: (v) => stateSpaceWithTangents(v, o) }, at, { ssq: pass.ssq, entry: pass.entry!, trace });
      expect(g).not.toBeNull();
      const objective = (v: Float64Array): number => {
        const f = kalmanFilter(y, seasonal(v), { tol: 1e-10, complete: true });
        return 0.5 * Math.log(f.ssq / f.nUsed) + (0.5 * f.sumLogF) / f.nUsed;
      };
      expectCentralDifferences(g!, objective, at, 1e-5, 1e-6);
    });
  });

  // The natural-MA start of fit.ts searches the MA coefficients as they are (R's "ML"), so the
  // MA part may leave the invertible region: the model is the plain polynomial product there,
  // built here independently, and the score must still match differences of the objective.
  describe('with the MA coefficients as they are (the natural-MA start)', () => {
    const naturalModel = (v: Float64Array, o: { p: number; q: number; P: number; Q: number; period: number }): ArmaStateSpace => {
      const s = o.period || 1;
      const ar = toStationary(v.subarray(0, o.p));
      const sar = toStationary(v.subarray(o.p + o.q, o.p + o.q + o.P));
      return armaStateSpace(expandAr(ar, sar, s), expandMa(v.slice(o.p, o.p + o.q), v.slice(o.p + o.q + o.P), s));
    };

    it.each([
      ['ARMA(2,2) with an MA root inside the unit circle', { p: 2, q: 2, P: 0, Q: 0, period: 0 }, [0.4, -0.3, 1.6, 0.7]],
      ['ARMA(1,2)(1,1)_12 with a seasonal MA coefficient beyond 1', { p: 1, q: 2, P: 1, Q: 1, period: 12 }, [0.4, 0.3, -0.2, 0.5, -1.3]],
    ])('%s: the same model, and derivatives within 1e-7 of central differences', (_n, o, u) => {
      const at = Float64Array.from(u);
      const { ss, dPhi, dR } = stateSpaceWithTangents(at, o, true);
      const ref = naturalModel(at, o);
      expect(ss.r).toBe(ref.r);
      for (let i = 0; i < ss.r; i++) {
        expect(ss.phi[i]).toBeCloseTo(ref.phi[i], 14);
        expect(ss.R[i]).toBeCloseTo(ref.R[i], 14);
      }
      const h = 1e-6;
      for (let j = 0; j < u.length; j++) {
        const up = Float64Array.from(u);
        const down = Float64Array.from(u);
        up[j] += h;
        down[j] -= h;
        const a = naturalModel(up, o);
        const b = naturalModel(down, o);
        for (let i = 0; i < ss.r; i++) {
          expect(Math.abs(dPhi[j * ss.r + i] - (a.phi[i] - b.phi[i]) / (2 * h))).toBeLessThan(1e-7);
          expect(Math.abs(dR[j * ss.r + i] - (a.R[i] - b.R[i]) / (2 * h))).toBeLessThan(1e-7);
        }
      }
    });

    it('ARMA(3,3) with an MA root inside the unit circle: the steady-state score within 1e-6 of central differences', () => {
      const o = { p: 3, q: 3, P: 0, Q: 0, period: 0 };
      // θ = (0.3, −0.2, 1.5): |θ₃| > 1, so a root lies inside the unit circle
      const at = Float64Array.from([0.5, -0.3, 0.2, 0.3, -0.2, 1.5]);
      const objective = (v: Float64Array): number => {
        const f = kalmanFilter(y, naturalModel(v, o), { tol: 1e-10, complete: true });
        return 0.5 * Math.log(f.ssq / f.nUsed) + (0.5 * f.sumLogF) / f.nUsed;
      };
      const trace = new Float64Array(y.length);
      const pass = kalmanFilter(y, naturalModel(at, o), { tol: 1e-10, complete: true, trace });
      expect(pass.entry).toBeDefined();
      const g = steadyStateScore({ x: y, model: (v) => stateSpaceWithTangents(v, o, true) }, at, { ssq: pass.ssq, entry: pass.entry!, trace });
      expect(g).not.toBeNull();
      expectCentralDifferences(g!, objective, at, 1e-5, 1e-6);
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
