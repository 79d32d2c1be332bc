import { simulateArma21 } from '../cli/bench-series';
import { concentratedLogLik, kalmanFilter, steadyCovarianceFromRow } from './kalman';
import { expandAr, expandMa } from './polynomials';
import { denseFilter } from './dense-filter.testing';
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

/**
 * A seasonal state (r = 26) with missing hours: the start-up by the quick recursions up to the
 * first missing hour, then the whole covariance rebuilt from its steady first row or, before the
 * steady state, the gapless filter carried on with the gaps' low-rank deviation (steady-gap.ts),
 * against the full Riccati recursion throughout (the same series behind one leading missing
 * hour, as above; with tol = 0 it never switches to the steady state).
 */
describe('kalmanFilter: a large state with missing hours', () => {
  const y = Float64Array.from(simulateArma21(1200, 4));
  const ss = armaStateSpace(expandAr([0.5], [0.6], 24), expandMa([0.3], [-0.5], 24));
  const withGaps = (at: number[]) => {
    const g = Float64Array.from(y);
    for (const t of at) g[t] = NaN;
    return g;
  };
  it.each([
    ['gaps after the steady state', [500, 501, 900]],
    ['a gap before the steady state (the gapless filter plus the deviation)', [3, 800]],
  ])('%s: same log-likelihood as the full recursion', (_name, at) => {
    const g = withGaps(at as number[]);
    const behind = Float64Array.from([NaN, ...g]);
    for (const tol of [1e-10, 0]) {
      const a = kalmanFilter(g, ss, { tol });
      const b = kalmanFilter(behind, ss, { tol });
      expect(a.nUsed).toBe(b.nUsed);
      expect(Math.abs(concentratedLogLik(a) - concentratedLogLik(b))).toBeLessThan(1e-7);
    }
  });

  it('steadyCovarianceFromRow rebuilds the steady covariance the filter tracked in full', () => {
    const r = ss.r;
    const s = r + 1;
    const f = kalmanFilter(y, ss, { tol: 0, keepState: true });
    const full = f.PPred as Float64Array;
    const P = new Float64Array(s * s);
    for (let j = 0; j < r; j++) P[j] = full[j];
    steadyCovarianceFromRow(P, ss.R, r);
    for (let i = 0; i < r; i++) for (let j = i; j < r; j++) expect(Math.abs(P[i * s + j] - full[i * r + j])).toBeLessThan(1e-9 * full[0]);
  });
});

/**
 * The mean profiled out by GLS inside the filter (the column of ones filtered beside the data,
 * de Jong 1991). For AR(1) with a stationary start the exact GLS mean has a closed form (the
 * exact AR(1) likelihood, Hamilton 1994, §5.2): minimising
 * (1 − φ²)(x₁ − μ)² + Σ_{t≥2} (x_t − φ x_{t−1} − (1 − φ) μ)² gives
 * μ̂ = [(1 − φ²) x₁ + (1 − φ) Σ_{t≥2} (x_t − φ x_{t−1})] / [(1 − φ²) + (n − 1)(1 − φ)²].
 */
describe('kalmanFilter: the mean profiled out', () => {
  const y = Float64Array.from(simulateArma21(800, 21), (v) => v + 250);

  it('AR(1): the GLS mean of the closed form, on the quick path and on the general one', () => {
    const phi = 0.7;
    const n = y.length;
    let s = (1 - phi * phi) * y[0];
    for (let t = 1; t < n; t++) s += (1 - phi) * (y[t] - phi * y[t - 1]);
    const closedForm = s / (1 - phi * phi + (n - 1) * (1 - phi) ** 2);
    const ss = armaStateSpace([phi], []);
    const quick = kalmanFilter(y, ss, { profileMean: true, complete: true });
    // asking for residuals takes the general recursions
    const general = kalmanFilter(y, ss, { profileMean: true, residuals: new Float64Array(n) });
    expect(quick.mean).toBeCloseTo(closedForm, 9);
    expect(general.mean).toBeCloseTo(closedForm, 9);
  });

  it.each([
    ['ARMA(2,2) near a unit MA root (settles late)', [0.5, -0.3], [1.6, 0.62]],
    ['ARMA(3,3)', [0.5, -0.3, 0.1], [0.9, 0.5, 0.2]],
    ['ARMA(2,1) near a unit AR root', [1.19, -0.205], [-0.6]],
  ])('%s: the quick path gives the general recursions’ mean and likelihood', (_n, ar, ma) => {
    const ss = armaStateSpace(ar, ma);
    const quick = kalmanFilter(y, ss, { profileMean: true, complete: true });
    const general = kalmanFilter(y, ss, { profileMean: true, residuals: new Float64Array(y.length) });
    expect(quick.mean).toBeCloseTo(general.mean, 8);
    expect(Math.abs(concentratedLogLik(quick) - concentratedLogLik(general))).toBeLessThan(1e-7);
  });
});

/**
 * With the mean profiled out, `traceOnes` hands the fit what a plain pass over x − μ̂ would give
 * the steady-state score (its predictions after the switch, and the start-up's state and sum of
 * squares), without that pass: checked against the plain pass itself, on the scalar path (up to
 * four states) and on the general one (a seasonal block).
 */
describe('kalmanFilter: the pass over x − μ̂ from the profiled one', () => {
  const y = Float64Array.from(simulateArma21(900, 29), (v) => v + 480);
  it.each([
    ['ARMA(3,3)', [0.5, -0.3, 0.1], [0.9, 0.5, 0.2]],
    ['ARMA(2,1) near a unit AR root', [1.19, -0.205], [-0.6]],
    ['ARMA(1,1)(0,1)_12, fourteen states', expandAr([0.6], [], 12), expandMa([0.3], [-0.5], 12)],
  ])('%s: predictions, start-up state and sum of squares as the plain pass gives them', (_n, ar, ma) => {
    const ss = armaStateSpace(ar, ma);
    const trace = new Float64Array(y.length);
    const traceOnes = new Float64Array(y.length);
    const profiled = kalmanFilter(y, ss, { profileMean: true, complete: true, trace, traceOnes });
    const mu = profiled.mean;
    const centred = Float64Array.from(y, (v) => v - mu);
    const plainTrace = new Float64Array(y.length);
    const plain = kalmanFilter(centred, ss, { complete: true, trace: plainTrace });
    const e = profiled.entry!;
    const p = plain.entry!;
    expect(e.steadyAt).toBe(p.steadyAt);
    expect(e.steadyAt).toBeGreaterThan(0);
    expect(e.ones).toBeDefined();
    expect(Math.abs(profiled.ssq - plain.ssq) / plain.ssq).toBeLessThan(1e-9);
    expect(Math.abs(e.ssq - 2 * mu * e.ones!.sxy + mu * mu * e.ones!.sxx - p.ssq)).toBeLessThan(1e-8 * Math.max(1, p.ssq));
    for (let i = 0; i < ss.r; i++) expect(Math.abs(e.a[i] - mu * e.ones!.c[i] - p.a[i])).toBeLessThan(1e-8 * 480);
    for (let t = e.steadyAt + 1; t < y.length; t++) expect(Math.abs(trace[t] - mu * traceOnes[t] - plainTrace[t])).toBeLessThan(1e-8 * 480);
  });
});

/**
 * A final pass (residuals, predictions and the end state, as a fit's last pass and the hourly
 * update make) runs its steady stretches in scalars. With tol = 0 the filter never switches to
 * the steady state and runs the time-varying recursions throughout: both must give the same
 * outputs to round-off, with and without missing hours.
 */
describe('kalmanFilter: the final pass in the steady state', () => {
  const y = Float64Array.from(simulateArma21(900, 23));
  const gappy = Float64Array.from(y);
  for (const t of [300, 301, 650]) gappy[t] = NaN;
  it.each([
    ['MA(1)', [], [0.83]],
    ['ARMA(1,1)', [0.9], [0.2]],
    ['ARMA(3,2)', [0.5, -0.2, 0.1], [0.4, 0.3]],
  ])('%s: residuals, predictions and end state as the time-varying recursions give them', (_n, ar, ma) => {
    const ss = armaStateSpace(ar, ma);
    for (const x of [y, gappy]) {
      const run = (tol: number) => {
        const residuals = new Float64Array(x.length);
        const predictions = new Float64Array(x.length);
        const f = kalmanFilter(x, ss, { mean: 0.7, tol, residuals, predictions, keepState: true });
        return { f, residuals, predictions };
      };
      const steady = run(1e-10);
      const full = run(0);
      expect(steady.f.steadyAt).toBeGreaterThanOrEqual(0);
      expect(full.f.steadyAt).toBe(-1);
      for (let t = 0; t < x.length; t++) {
        if (Number.isNaN(x[t])) expect(steady.residuals[t]).toBeNaN();
        else expect(Math.abs(steady.residuals[t] - full.residuals[t])).toBeLessThan(1e-6);
        expect(Math.abs(steady.predictions[t] - full.predictions[t])).toBeLessThan(1e-6);
      }
      for (let i = 0; i < ss.r; i++) expect(Math.abs(steady.f.aPred![i] - full.f.aPred![i])).toBeLessThan(1e-6);
      expect(Math.abs(concentratedLogLik(steady.f) - concentratedLogLik(full.f))).toBeLessThan(1e-6);
    }
  });
});

describe('kalmanFilter through missing hours with a small state (riccatiStepSmall), against the dense textbook filter', () => {
  // every state size the scalar step serves, an MA part near the unit circle (the covariance
  // moves for the rest of the series after each gap) and one that settles
  const y = Float64Array.from(simulateArma21(600, 23));
  for (const t of [0, 40, 41, 42, 250, 599]) y[t] = NaN;
  it.each([
    ['AR(1)', [0.7], []],
    ['MA(1) near the unit circle', [], [-0.97]],
    ['ARMA(1,2)', [0.5], [0.4, -0.3]],
    ['ARMA(3,3) with an MA root near the circle', [0.5, -0.2, 0.1], [-0.9, 0.1, 0.05]],
    ['ARMA(2,3)', [1.2, -0.5], [0.3, 0.2, 0.1]],
  ])('%s: the same log-likelihood', (_name, ar, ma) => {
    const ss = armaStateSpace(ar as number[], ma as number[]);
    const f = kalmanFilter(y, ss, { tol: 1e-10 });
    expect(Math.abs(concentratedLogLik(f) - denseFilter(y, ss, 0).logLik)).toBeLessThan(1e-6);
  });
});
