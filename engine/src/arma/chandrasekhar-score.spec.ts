import { simulateArma21 } from '../cli/bench-series';
import taylor from '../fixtures/taylor-hourly.json';
import { difference } from '../series/differencing';
import { chandrasekharScore, generalAdjoint, smallAdjoint } from './chandrasekhar-score';
import { firstRowTangents } from './first-row-tangents';
import { kalmanFilter, SteadyEntry } from './kalman';
import { armaStateSpace, ArmaStateSpace, seriesCovarianceTangents, stationaryCovarianceTangents } from './state-space';
import { Orders, stateSpaceWithTangents } from './state-space-tangents';

/**
 * The backward Chandrasekhar score is a rewriting of the gradient, so it is checked against the
 * plain definition: central differences of the fit's objective, ½ log(S/n) + ½ Σ log F_t / n,
 * with the Kalman filter run in full at each probe.
 */
function objective(y: Float64Array, o: Orders, v: Float64Array, tol: number): number {
  const f = kalmanFilter(y, stateSpaceWithTangents(v, o).ss, { tol, complete: true });
  return 0.5 * Math.log(f.ssq / f.nUsed) + (0.5 * f.sumLogF) / f.nUsed;
}

/** The score at u within 1e-6 of central differences (±1e-5) of the objective, its filter run with tol. */
function expectCentralDifferences(y: Float64Array, o: Orders, u: number[], tol: number): void {
  const at = Float64Array.from(u);
  const g = chandrasekharScore(y, stateSpaceWithTangents(at, o), at.length);
  expect(g).not.toBeNull();
  for (let j = 0; j < at.length; j++) {
    const h = 1e-5;
    const up = Float64Array.from(at);
    const down = Float64Array.from(at);
    up[j] += h;
    down[j] -= h;
    const central = (objective(y, o, up, tol) - objective(y, o, down, tol)) / (2 * h);
    expect(Math.abs(g![j] - central)).toBeLessThan(1e-6);
  }
}

describe('chandrasekharScore: the gradient where the filter does not settle', () => {
  const daily = Float64Array.from(difference(taylor.load as number[], [24]));
  const simulated = Float64Array.from(simulateArma21(1500, 17));
  const cases: Array<{ name: string; y: Float64Array; o: Orders; u: number[] }> = [
    // a seasonal MA part near the unit circle: the filter's covariance still moves at the end
    { name: 'daily-differenced demand, ARMA(0,2)(1,1)_24', y: daily, o: { p: 0, q: 2, P: 1, Q: 1, period: 24 }, u: [0.3, -0.8, 0.2, -1.6] },
    { name: 'daily-differenced demand, ARMA(3,3)(1,1)_24', y: daily, o: { p: 3, q: 3, P: 1, Q: 1, period: 24 }, u: [0.5, -0.2, 0.1, -0.4, 0.3, -0.2, 0.2, -1.5] },
    { name: 'simulated, ARMA(2,2) with a small state', y: simulated, o: { p: 2, q: 2, P: 0, Q: 0, period: 0 }, u: [0.3, 0.2, 1.6, 0.3] },
  ];

  it.each(cases)('$name: within 1e-6 of central differences', ({ y, o, u }) => expectCentralDifferences(y, o, u, 1e-10));

  // up to four states the adjoint runs in scalars (smallAdjoint): the weekly-differenced demand
  // series, whose MA part sits near the unit circle, with one to four states
  const weekly = Float64Array.from(difference(taylor.load as number[], [168]));
  const small: Array<{ name: string; o: Orders; u: number[] }> = [
    { name: 'ARMA(1,0), one state', o: { p: 1, q: 0, P: 0, Q: 0, period: 0 }, u: [1.2] },
    { name: 'ARMA(2,1), two states', o: { p: 2, q: 1, P: 0, Q: 0, period: 0 }, u: [1.5, -0.3, -1.1] },
    { name: 'ARMA(1,2), three states', o: { p: 1, q: 2, P: 0, Q: 0, period: 0 }, u: [0.9, -0.4, 0.6] },
    { name: 'ARMA(3,3), four states', o: { p: 3, q: 3, P: 0, Q: 0, period: 0 }, u: [1.1, -0.5, 0.3, -0.2, 0.4, -1.9] },
  ];
  // the differences with the filter run in full (tol 0): this close to the unit circle its switch
  // to the steady state at 1e-10 moves them by a few 1e-6, as the objective of a fit allows
  it.each(small)('weekly-differenced demand, $name: within 1e-6 of central differences', ({ o, u }) => expectCentralDifferences(weekly, o, u, 0));

  it('the scalar adjoint of up to four states gives the general one to the last bit (the same sums in the same order)', () => {
    let compared = 0;
    for (const { o, u } of small) {
      for (const shift of [0, 0.7, -1.3]) {
        const at = Float64Array.from(u, (v, i) => v + (i % 2 ? shift : -shift));
        const { ss, dPhi, dR } = stateSpaceWithTangents(at, o);
        const { row } = stationaryCovarianceTangents(ss, dPhi, dR, at.length);
        const a = smallAdjoint(weekly, ss.phi, row, ss.r);
        const b = generalAdjoint(weekly, ss.phi, row, ss.r);
        expect(a).not.toBeNull();
        expect(Array.from(a!.phib)).toEqual(Array.from(b!.phib));
        expect(Array.from(a!.rowb)).toEqual(Array.from(b!.rowb));
        compared++;
      }
    }
    expect(compared).toBe(12);
  });

  it('the seasonal case is one where the filter never reaches its steady state', () => {
    const { ss } = stateSpaceWithTangents(Float64Array.from(cases[0].u), cases[0].o);
    expect(kalmanFilter(daily, ss, { tol: 1e-10, complete: true }).steadyAt).toBe(-1);
  });
});

/**
 * Run over the filter's start-up only, from a seed (what the steady-state score does), the
 * adjoint is the gradient of G = ½/S · Σ v²/F + ½/n · Σ log F + ā·a + p̄·p + φ̄·φ over hours
 * 0..t₀, a and p the predicted state and first row of P after them, with any weights ā, p̄, φ̄:
 * checked against central differences of G along directions in φ and R, G computed by the
 * plain Kalman filter stopped at t₀ (its time-varying recursions, not the Chandrasekhar form).
 */
describe('the adjoint over the start-up only, from a seed', () => {
  const y = Float64Array.from(simulateArma21(400, 3));
  const models: Array<{ name: string; ss: ArmaStateSpace }> = [
    { name: 'three states (smallAdjoint)', ss: armaStateSpace([0.5, -0.3, 0.2], [0.4, 0.1]) },
    { name: 'four states (smallAdjoint)', ss: armaStateSpace([0.5, -0.3], [0.4, 0.1, -0.6]) },
    { name: 'a seasonal MA block, 26 states (generalAdjoint)', ss: armaStateSpace([0.6], [0.3, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, -0.7, -0.21]) },
  ];
  const cases = models.flatMap((m) => [0, 5, 60].map((t0) => ({ ...m, t0 })));

  it.each(cases)('$name, to hour $t0: within 1e-6 (relative) of central differences', ({ ss, t0 }) => {
    const r = ss.r;
    const weights = (seed: number) => Float64Array.from({ length: Math.max(r, 4) }, (_, i) => (i < r ? Math.sin(seed + 1.7 * i) : 0));
    const a = weights(1);
    const p = weights(2);
    const phiSeed = weights(3);
    const ssqBar = 0.37;
    const logBar = 0.011;
    const G = (model: ArmaStateSpace): number => {
      const e: SteadyEntry = kalmanFilter(y, model, { stopAt: t0, complete: true }).entry!;
      let g = ssqBar * e.ssq + logBar * e.sumLogF;
      for (let i = 0; i < r; i++) g += a[i] * e.a[i] + p[i] * e.gain[i] * e.F + phiSeed[i] * model.phi[i];
      return g;
    };
    // two directions: AR coefficients; AR and MA together
    const dPhi = Float64Array.from({ length: 2 * r }, (_, i) => (i < r ? (i === 0 ? 1 : 0) : i - r < 1 ? 0.3 : 0));
    const dR = Float64Array.from({ length: 2 * r }, (_, i) => (i >= r && i - r >= 1 ? 0.2 * Math.cos(i) : 0));
    const { row, dRow } = stationaryCovarianceTangents(ss, dPhi, dR, 2);
    const seed = { hours: t0 + 1, ssqBar, logBar, a, p, phi: phiSeed };
    const adj = (r <= 4 ? smallAdjoint : generalAdjoint)(y, ss.phi, row, r, seed);
    expect(adj).not.toBeNull();
    const h = 1e-6;
    for (let j = 0; j < 2; j++) {
      let g = 0;
      for (let i = 0; i < r; i++) g += adj!.phib[i] * dPhi[j * r + i] + adj!.rowb[i] * dRow[j * r + i];
      const moved = (sign: number): ArmaStateSpace => ({ r, phi: ss.phi.map((v, i) => v + sign * h * dPhi[j * r + i]), R: ss.R.map((v, i) => v + sign * h * dR[j * r + i]) });
      const central = (G(moved(1)) - G(moved(-1))) / (2 * h);
      expect(Math.abs(g - central)).toBeLessThan(1e-6 * (1 + Math.abs(central)));
    }
  });
});

describe('firstRowTangents: the stationary covariance’s first row and its derivatives', () => {
  // checked against the series form P = Σ_k (T^k R)(T^k R)' summed term by term with its
  // tangents (state-space.ts), another route to the same quantities
  const cases: Array<{ name: string; o: Orders; u: number[] }> = [
    { name: 'ARMA(0,2)(1,1)_24', o: { p: 0, q: 2, P: 1, Q: 1, period: 24 }, u: [0.3, -0.8, 0.2, -1.6] },
    { name: 'ARMA(3,3)(1,1)_24', o: { p: 3, q: 3, P: 1, Q: 1, period: 24 }, u: [0.5, -0.2, 0.1, -0.4, 0.3, -0.2, 0.2, -1.5] },
    { name: 'ARMA(1,0)(1,0)_24, rows pivoted in the solve', o: { p: 1, q: 0, P: 1, Q: 0, period: 24 }, u: [0.9, 1.2] },
    { name: 'ARMA(2,1)(1,1)_24 at zero, where every coefficient is zero but moves', o: { p: 2, q: 1, P: 1, Q: 1, period: 24 }, u: [0, 0, 0, 0, 0] },
  ];
  it.each(cases)('$name: within 1e-10 (relative) of the summed series', ({ o, u }) => {
    const { ss, dPhi, dR } = stateSpaceWithTangents(Float64Array.from(u), o);
    const ours = firstRowTangents(ss.r, ss.phi, ss.R, dPhi, dR, u.length);
    expect(ours).not.toBeNull();
    const sum = seriesCovarianceTangents(ss, dPhi, dR, u.length);
    const scale = Math.abs(sum.row[0]);
    for (let i = 0; i < ss.r; i++) expect(Math.abs(ours!.row[i] - sum.row[i]) / scale).toBeLessThan(1e-10);
    for (let i = 0; i < sum.dRow.length; i++) expect(Math.abs(ours!.dRow[i] - sum.dRow[i]) / Math.max(1, scale)).toBeLessThan(1e-10);
  });
});
