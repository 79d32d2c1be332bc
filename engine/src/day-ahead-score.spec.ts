/**
 * The day-ahead evidence's summaries: the plain mean of the daily MAPEs and the mean with recent
 * days weighted more, which the pipeline ranks its candidates by. Expected values worked by hand.
 */
import { recencyWeightedMean, scoreDayAhead, SELECTION_HALF_LIFE_DAYS } from './day-ahead-score';
import type { IntervalForecast } from './series/interval-forecast';

describe('recencyWeightedMean', () => {
  it('halves the weight every half-life back from the last day', () => {
    // days 0 and 14 with a half-life of 14: weights 1/2 and 1, so (0.5·4 + 1·1) / 1.5 = 2
    expect(recencyWeightedMean([4, 1], [0, 14], 14, 14)).toBeCloseTo(2, 12);
    // three days a half-life apart: weights 1/4, 1/2, 1 → (0.25·8 + 0.5·4 + 1·2) / 1.75 = 6 / 1.75
    expect(recencyWeightedMean([8, 4, 2], [0, 7, 14], 14, 7)).toBeCloseTo(6 / 1.75, 12);
  });

  it('is the plain mean for equal values or one day, NaN for none', () => {
    expect(recencyWeightedMean([3, 3, 3], [0, 1, 2], 2)).toBeCloseTo(3, 12);
    expect(recencyWeightedMean([5], [9], 9)).toBe(5);
    expect(recencyWeightedMean([], [], 0)).toBeNaN();
  });

  it('weighs by the day, not by the position: a day left unscored keeps the ages of the others', () => {
    const withGap = recencyWeightedMean([4, 1], [0, 2], 2, 2); // ages 2 and 0: weights 1/2, 1
    expect(withGap).toBeCloseTo((0.5 * 4 + 1) / 1.5, 12);
  });

  it('uses a half-life of two weeks by default (a factor of 0.952 a day)', () => {
    expect(SELECTION_HALF_LIFE_DAYS).toBe(14);
    expect(Math.pow(0.5, 1 / SELECTION_HALF_LIFE_DAYS)).toBeCloseTo(0.952, 3);
  });
});

describe('scoreDayAhead', () => {
  // a flat 100 MW series forecast at 100 + k_d MW on test day d: that day's MAPE is exactly k_d %
  const y = new Array(24 * 5).fill(100);
  const miss = [4, 4, 1, 1];
  const forecastFrom = (origin: number, h: number): IntervalForecast => {
    const d = origin / 24 - 1; // test days start at hour 24
    return { mean: new Array(h).fill(100 + miss[d]), se: new Array(h).fill(1), lower80: [], upper80: [], lower95: [], upper95: [] };
  };

  it('gives the plain mean and the recency-weighted mean of the same daily MAPEs', () => {
    const s = scoreDayAhead(y, 24, 4, 0, forecastFrom);
    expect(s.daily.map((m) => +m.toFixed(9))).toEqual([4, 4, 1, 1]);
    expect(s.mape).toBeCloseTo(2.5, 9);
    const w = [3, 2, 1, 0].map((age) => Math.pow(0.5, age / 14));
    expect(s.recentMape).toBeCloseTo((4 * w[0] + 4 * w[1] + w[2] + w[3]) / (w[0] + w[1] + w[2] + w[3]), 9);
    expect(s.recentMape).toBeLessThan(s.mape);
  });
});
