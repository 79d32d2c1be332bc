/**
 * Band calibration from standardised out-of-sample errors. Expected values from outside the code:
 * R 4.2.2 `quantile(c(1, 2, 3, 4, 10), c(.8, .95))` = 5.2, 8.8 (type 7) and 4, 10 (type = 1); normal quantiles
 * `qnorm(c(.9, .975))` = 1.281551566, 1.959963985 (jStat's inverse normal for the half-normal grid); the Laplace distribution's |z| is exponential,
 * whose c-quantile is −b·ln(1 − c) (textbook).
 */
import { jStat } from 'jstat';
import { bandScaleFromErrors, HALF_LIFE_DAYS, MIN_CALIBRATION_HOURS, quantileSorted, scaleBands, UNSCALED, weightedQuantile } from './band-calibration';

const Z80 = 1.281551566;
const Z95 = 1.959963985;

/** Deterministic "sample" of N values at the mid-point quantiles of a distribution. */
const grid = (n: number, inv: (u: number) => number) => Array.from({ length: n }, (_, i) => inv((i + 0.5) / n));

describe('quantileSorted (R type 7)', () => {
  it('matches R on a small sample', () => {
    const x = [1, 2, 3, 4, 10];
    expect(quantileSorted(x, 0.8)).toBeCloseTo(5.2, 12);
    expect(quantileSorted(x, 0.95)).toBeCloseTo(8.8, 12);
    expect(quantileSorted(x, 0)).toBe(1);
    expect(quantileSorted(x, 1)).toBe(10);
  });
});

describe('weightedQuantile', () => {
  it('with equal weights is R type 1 (the inverse of the ECDF)', () => {
    // R 4.2.2: quantile(c(1, 2, 3, 4, 10), c(.8, .95), type = 1) = 4, 10
    const x = [10, 3, 1, 4, 2];
    const w = [1, 1, 1, 1, 1];
    expect(weightedQuantile(x, w, 0.8)).toBe(4);
    expect(weightedQuantile(x, w, 0.95)).toBe(10);
  });

  it('with weights: the smallest value whose cumulative weight reaches p of the total', () => {
    // weights 0.5^((4:0)/3); R: cumsum(w)/sum(w) = 0.1195 0.2701 0.4598 0.6988 1.0000
    const x = [1, 2, 3, 4, 10];
    const w = [4, 3, 2, 1, 0].map((a) => Math.pow(0.5, a / 3));
    expect(weightedQuantile(x, w, 0.1)).toBe(1);
    expect(weightedQuantile(x, w, 0.27)).toBe(2);
    expect(weightedQuantile(x, w, 0.5)).toBe(4);
    expect(weightedQuantile(x, w, 0.7)).toBe(10);
  });
});

describe('bandScaleFromErrors', () => {
  it('leaves the bands of a model whose errors are normal as they are', () => {
    // |z| of a standard normal has its 80 % quantile at Z80 and its 95 % one at Z95
    const absNormal = grid(4000, (u) => halfNormalQuantile(u));
    const s = bandScaleFromErrors(absNormal);
    expect(s.k95).toBeCloseTo(1, 2);
    expect(s.k80).toBeCloseTo(1, 2);
    expect(s.hours).toBe(4000);
  });

  it('widens both bands when the errors are twice what the model says', () => {
    const s = bandScaleFromErrors(grid(4000, (u) => 2 * halfNormalQuantile(u)));
    expect(s.k95).toBeCloseTo(2, 2);
    expect(s.k80).toBeCloseTo(2, 2);
  });

  it('calibrates each level on its own quantile: heavy-tailed (Laplace) errors narrow the 80 % band and widen the 95 %', () => {
    const b = 1 / Math.SQRT2; // unit variance
    const s = bandScaleFromErrors(grid(20000, (u) => -b * Math.log(1 - u)));
    expect(s.k80).toBeCloseTo((b * Math.log(5)) / Z80, 2); // 0.8881
    expect(s.k95).toBeCloseTo((b * Math.log(20)) / Z95, 2); // 1.0807
  });

  it('on a calm spell narrows the 80 % band but never the 95 % band below the model’s own', () => {
    const s = bandScaleFromErrors(grid(2000, (u) => 0.5 * halfNormalQuantile(u)));
    expect(s.k80).toBeCloseTo(0.5, 2);
    expect(s.k95).toBe(1);
  });

  it('keeps the 95 % scale at least the 80 % one when the errors are lighter-tailed than the normal', () => {
    // |z| uniform on [0, 2]: 80 % quantile 1.6, 95 % quantile 1.9 → 1.6/Z80 = 1.248 > 1.9/Z95 = 0.969
    const s = bandScaleFromErrors(grid(4000, (u) => 2 * u));
    expect(s.k80).toBeCloseTo(1.6 / Z80, 2);
    expect(s.k95).toBe(s.k80);
  });

  it('weighs recent days more: errors doubled over the last three days move the scales most of the way', () => {
    // 28 days of 24 hours; weights halve every HALF_LIFE_DAYS (3) days back
    const calm = grid(24, (u) => halfNormalQuantile(u));
    const z: number[] = [];
    const day: number[] = [];
    for (let d = 0; d < 28; d++) for (const v of calm) {
      z.push(d >= 25 ? 2 * v : v);
      day.push(d);
    }
    const weighted = bandScaleFromErrors(z, day);
    const equal = bandScaleFromErrors(z);
    // the last three days hold half the weight (geometric series); the weighted 80 % quantile x
    // solves ½·P(|Z| ≤ x) + ½·P(|Z| ≤ x/2) = 0.8, x ≈ 1.9 (k80 ≈ 1.48); with equal weights
    // 25/28·P(|Z| ≤ x) + 3/28·P(|Z| ≤ x/2) = 0.8, x ≈ 1.35 (k80 ≈ 1.05)
    expect(HALF_LIFE_DAYS).toBe(3);
    expect(weighted.k80).toBeGreaterThan(1.35);
    expect(weighted.k80).toBeLessThan(1.6);
    expect(equal.k80).toBeGreaterThan(0.98);
    expect(equal.k80).toBeLessThan(1.12);
  });

  it('signs do not matter, non-finite errors are skipped, too few hours leave the bands alone', () => {
    const half = grid(400, (u) => halfNormalQuantile(u));
    const signed = half.map((v, i) => (i % 2 ? -v : v));
    expect(bandScaleFromErrors([...signed, NaN, Infinity])).toEqual(bandScaleFromErrors(half));
    expect(bandScaleFromErrors(half.slice(0, MIN_CALIBRATION_HOURS - 1))).toEqual(UNSCALED);
  });
});

describe('scaleBands', () => {
  it('moves the bounds to mean ± k·z·se and keeps mean and se', () => {
    const f = { mean: [100, 200], se: [10, 20], lower80: [0, 0], upper80: [0, 0], lower95: [0, 0], upper95: [0, 0] };
    const g = scaleBands(f, { k80: 0.9, k95: 1.5, hours: 500 });
    expect(g.mean).toEqual(f.mean);
    expect(g.se).toEqual(f.se);
    expect(g.upper80[1]).toBeCloseTo(200 + 0.9 * Z80 * 20, 6);
    expect(g.lower95[0]).toBeCloseTo(100 - 1.5 * Z95 * 10, 6);
  });
});

/** Quantile of |Z|, Z standard normal: Φ⁻¹((1 + u)/2), from jStat's normal inverse. */
function halfNormalQuantile(u: number): number {
  return jStat.normal.inv((1 + u) / 2, 0, 1);
}
