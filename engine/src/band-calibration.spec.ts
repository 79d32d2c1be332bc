/**
 * Band calibration from standardised out-of-sample errors. Expected values from outside the code:
 * R 4.2.2 `quantile(c(1, 2, 3, 4, 10), c(.8, .95))` = 5.2, 8.8 (type 7); normal quantiles
 * `qnorm(c(.9, .975))` = 1.281551566, 1.959963985 (jStat's inverse normal for the half-normal grid); the Laplace distribution's |z| is exponential,
 * whose c-quantile is −b·ln(1 − c) (textbook).
 */
import { jStat } from 'jstat';
import { bandScaleFromErrors, MIN_CALIBRATION_HOURS, quantileSorted, scaleBands, UNSCALED } from './band-calibration';

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

  it('on heavy-tailed (Laplace) errors: the 95 % scale from the tail, the 80 % band narrower in proportion', () => {
    const b = 1 / Math.SQRT2; // unit variance
    const s = bandScaleFromErrors(grid(20000, (u) => -b * Math.log(1 - u)));
    const q80 = b * Math.log(5);
    const q95 = b * Math.log(20);
    expect(s.k95).toBeCloseTo(Math.max(1, q95 / Z95), 2); // 1.0807
    expect(s.k80).toBeCloseTo((s.k95 * (q80 / q95)) / (Z80 / Z95), 2); // 0.9711
    expect(s.k80).toBeLessThan(1);
  });

  it('never narrows the 95 % band below the model’s own, even on a calm month', () => {
    const s = bandScaleFromErrors(grid(2000, (u) => 0.5 * halfNormalQuantile(u)));
    expect(s.k95).toBe(1);
    expect(s.k80).toBeCloseTo(1, 2); // normal shape: the 80 % band keeps its place relative to the 95 %
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
