/**
 * Band calibration from standardised out-of-sample errors. Expected values from outside the code:
 * R 4.2.2 `quantile(c(1, 2, 3, 4, 10), c(.8, .95))` = 5.2, 8.8 (type 7) and 4, 10 (type = 1); normal quantiles
 * `qnorm(c(.9, .975))` = 1.281551566, 1.959963985 (jStat's inverse normal for the half-normal grid); the Laplace distribution's |z| is exponential,
 * whose c-quantile is −b·ln(1 − c) (textbook). The calibrated levels (Beran 1990) are checked on
 * days built so that the replay's coverage can be counted by hand, and against a direct
 * replay written here from weightedQuantile (itself checked against R above).
 */
import { jStat } from 'jstat';
import {
  bandScaleAtLevels,
  bandScaleFromErrors,
  calibratedLevels,
  FIRST_CHECKED_DAY,
  FLOOR_MAX_COVERAGE,
  HALF_LIFE_DAYS,
  LEVEL_STEP,
  MIN_CALIBRATION_HOURS,
  MIN_CHECKED_DAYS,
  quantileSorted,
  scaleBands,
  UNSCALED,
  weightedQuantile,
} from './band-calibration';

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

  it('without the errors’ days (nothing to replay) narrows the 80 % band but never the 95 % band below the model’s own', () => {
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
    // at the nominal levels, as the replay's levels would move these figures (tested below)
    const weighted = bandScaleAtLevels(z, day, 0.8, 0.95, true);
    const equal = bandScaleAtLevels(z, new Array(z.length).fill(0), 0.8, 0.95, true);
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

/** `days` days of the same 24 errors, the quantiles of |Z| at (i + ½)/24, times `scale(d)`. */
function steadyDays(days: number, scale: (d: number) => number = () => 1): { z: number[]; day: number[] } {
  const one = grid(24, (u) => halfNormalQuantile(u));
  const z: number[] = [];
  const day: number[] = [];
  for (let d = 0; d < days; d++) for (const v of one) {
    z.push(v * scale(d));
    day.push(d);
  }
  return { z, day };
}

/** The replay written out directly: every grid level, every checked day, weightedQuantile of the days before. */
function directLevels(z: number[], day: number[]): { p80: number; p95: number } {
  const levels: number[] = [];
  for (let p = 0.5; p <= 0.995 + 1e-9; p += LEVEL_STEP) levels.push(Math.round(p * 1e6) / 1e6);
  const cover = levels.map((p) => {
    let hit = 0;
    let n = 0;
    for (let t = day[0] + FIRST_CHECKED_DAY; t <= day[day.length - 1]; t++) {
      const before = z.map((v, i) => [v, day[i]]).filter(([, d]) => d < t);
      const q = weightedQuantile(before.map(([v]) => v), before.map(([, d]) => Math.pow(0.5, (t - 1 - d) / HALF_LIFE_DAYS)), p);
      z.forEach((v, i) => {
        if (day[i] !== t) return;
        n++;
        if (v <= q) hit++;
      });
    }
    return hit / n;
  });
  const pick = (c: number) => levels.find((p, k) => p >= c - 0.1 - 1e-9 && cover[k] >= c) ?? 0.995;
  return { p80: pick(0.8), p95: pick(0.95) };
}

describe('calibratedLevels (Beran 1990, by replaying the rule over the evidence)', () => {
  it('keeps the nominal levels, to the grid, when every day brings the same errors', () => {
    // the replay's q at level p is the ⌈24p⌉-th smallest of a day's 24 errors (each day the same,
    // so weights do not matter): covering 80 % of a day takes 20 of 24 → p > 19/24 → 0.795 on the
    // 0.005 grid, covering 20/24; 95 % takes 23 of 24 → p > 22/24 → 0.92, covering 23/24.
    // Checked: days 7..27, 21 of them.
    const { z, day } = steadyDays(28);
    const l = calibratedLevels(z, day)!;
    expect(l.p80).toBeCloseTo(0.795, 9);
    expect(l.p95).toBeCloseTo(0.92, 9);
    expect(l.checkedDays).toBe(28 - FIRST_CHECKED_DAY);
    expect(l.covered80).toBeCloseTo(20 / 24, 12);
    expect(l.covered95).toBeCloseTo(23 / 24, 12);
  });

  it('raises the levels when the errors grew after the first weeks, lowers them after a calm spell', () => {
    const rough = steadyDays(28, (d) => (d >= 21 ? 2 : 1));
    const calm = steadyDays(28, (d) => (d >= 21 ? 0.5 : 1));
    const up = calibratedLevels(rough.z, rough.day)!;
    const down = calibratedLevels(calm.z, calm.day)!;
    expect(up.p80).toBeGreaterThan(0.8);
    expect(up.p95).toBeGreaterThan(0.95);
    expect(down.p80).toBeLessThan(0.795);
    // the 95 % level stays: the steady days at 0.915 cover 22/24 and the calm ones at most all 24,
    // (14·22 + 7·24)/(21·24) = 0.944 < 0.95
    expect(down.p95).toBeCloseTo(0.92, 9);
    expect({ p80: up.p80, p95: up.p95 }).toEqual(directLevels(rough.z, rough.day));
    expect({ p80: down.p80, p95: down.p95 }).toEqual(directLevels(calm.z, calm.day));
  });

  it('matches the direct replay on irregular errors and skipped days', () => {
    // a deterministic, irregular sequence: the scale wanders from day to day, day 12 is missing
    const z: number[] = [];
    const day: number[] = [];
    for (let d = 0; d < 28; d++) {
      if (d === 12) continue;
      const scale = 0.6 + 0.5 * Math.abs(Math.sin(1.7 * d));
      for (let h = 0; h < 24; h++) {
        z.push(scale * halfNormalQuantile(((h * 7 + d * 5) % 24 + 0.5) / 24));
        day.push(d);
      }
    }
    const l = calibratedLevels(z, day)!;
    expect({ p80: l.p80, p95: l.p95 }).toEqual(directLevels(z, day));
  });

  it('needs MIN_CHECKED_DAYS checked days', () => {
    const short = steadyDays(FIRST_CHECKED_DAY + MIN_CHECKED_DAYS - 1);
    const enough = steadyDays(FIRST_CHECKED_DAY + MIN_CHECKED_DAYS);
    expect(calibratedLevels(short.z, short.day)).toBeNull();
    expect(calibratedLevels(enough.z, enough.day)?.checkedDays).toBe(MIN_CHECKED_DAYS);
  });
});

describe('bandScaleFromErrors with the errors’ days', () => {
  // 1.318011 = Φ⁻¹((1 + 19.5/24)/2) and 1.862732 = Φ⁻¹((1 + 22.5/24)/2), the 20th and 23rd of
  // the 24 errors (Python statistics.NormalDist.inv_cdf)
  it('sets each band from its calibrated level: steady errors keep the k95 ≥ k80 rule', () => {
    const { z, day } = steadyDays(28);
    const s = bandScaleFromErrors(z, day);
    expect(s.k80).toBeCloseTo(1.318011 / Z80, 5); // 1.028449
    // 1.862732 / Z95 = 0.950391 < k80
    expect(s.k95).toBe(s.k80);
  });

  it('holds no floor at the model’s band where the replay shows it too wide: errors steadily half the model’s give half-width bands', () => {
    const { z, day } = steadyDays(28, () => 0.5);
    const s = bandScaleFromErrors(z, day);
    expect(s.k80).toBeCloseTo((0.5 * 1.318011) / Z80, 5); // 0.514225
    expect(s.k95).toBeCloseTo(s.k80, 12);
    expect(s.k95).toBeLessThan(0.52);
    // without the days nothing can be replayed and the floor stays
    expect(bandScaleFromErrors(z).k95).toBe(1);
  });

  it('keeps the model’s 95 % band as the floor unless the replay shows it covering more than 97 %', () => {
    // the largest of the 24 errors is 2.310991 = Φ⁻¹((1 + 23.5/24)/2), the next 1.862732; Z95 = 1.959964.
    // At scale 0.9 the model’s band misses the largest (2.080) on every checked day: 23/24 = 0.958 ≤ 0.97,
    // the floor holds. At scale 0.8 it covers all 24 (1.849): the floor goes, k95 = k80.
    expect(FLOOR_MAX_COVERAGE).toBe(0.97);
    const a = steadyDays(28, () => 0.9);
    const b = steadyDays(28, () => 0.8);
    expect(calibratedLevels(a.z, a.day)!.modelCovered95).toBeCloseTo(23 / 24, 12);
    expect(calibratedLevels(b.z, b.day)!.modelCovered95).toBe(1);
    const sa = bandScaleFromErrors(a.z, a.day);
    const sb = bandScaleFromErrors(b.z, b.day);
    expect(sa.k80).toBeCloseTo((0.9 * 1.318011) / Z80, 5); // 0.925604
    expect(sa.k95).toBe(1);
    expect(sb.k80).toBeCloseTo((0.8 * 1.318011) / Z80, 5); // 0.822759
    expect(sb.k95).toBeCloseTo(sb.k80, 12);
  });

  it('keeps the nominal levels and the floor when the evidence is too short to replay', () => {
    const { z, day } = steadyDays(FIRST_CHECKED_DAY + MIN_CHECKED_DAYS - 1, () => 0.5);
    const s = bandScaleFromErrors(z, day);
    expect(s).toEqual(bandScaleAtLevels(z, day, 0.8, 0.95, true));
    expect(s.k95).toBe(1);
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
