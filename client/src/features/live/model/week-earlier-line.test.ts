import { WEEK_HOURS } from '@morrowline/shared';
import { describe, expect, it } from 'vitest';
import { MIN_ERRORS_FOR_BANDS, quantile, weekEarlierLine } from './week-earlier-line';

describe('weekEarlierLine', () => {
  it('forecasts each hour as the same hour one week earlier, with no forecast where that hour is missing', () => {
    const mw: (number | null)[] = Array.from({ length: WEEK_HOURS + 3 }, (_, i) => 100 + i);
    mw[1] = null;
    const line = weekEarlierLine(mw, WEEK_HOURS + 3);
    expect(line.mean.slice(0, WEEK_HOURS).every((v) => v === null)).toBe(true);
    expect(line.mean[WEEK_HOURS]).toBe(100);
    expect(line.mean[WEEK_HOURS + 1]).toBeNull();
    expect(line.mean[WEEK_HOURS + 2]).toBe(102);
  });

  it('draws bands from the spread of the last weeks of errors, wider at 95 % than at 80 %', () => {
    // Two weeks of history: the second week runs above the first by errors -10..+9 repeating.
    const mw: (number | null)[] = [];
    for (let i = 0; i < WEEK_HOURS; i++) mw.push(200);
    for (let i = 0; i < WEEK_HOURS; i++) mw.push(200 + ((i % 20) - 10));
    for (let i = 0; i < 24; i++) mw.push(null); // the coming day
    const origin = 2 * WEEK_HOURS;
    const line = weekEarlierLine(mw, origin);
    const t = origin + 5; // a week after hour WEEK_HOURS + 5, whose load was 195
    expect(line.mean[t]).toBe(195);
    const width80 = (line.upper80[t] as number) - (line.lower80[t] as number);
    const width95 = (line.upper95[t] as number) - (line.lower95[t] as number);
    expect(width80).toBeGreaterThan(10);
    expect(width95).toBeGreaterThan(width80);
    expect(line.lower95[t]).toBeLessThan(line.lower80[t] as number);
    expect(line.lower80[t]).toBeLessThan(195);
    expect(line.upper80[t]).toBeGreaterThan(195);
  });

  it('draws no bands while there are too few errors to judge the spread', () => {
    const mw: (number | null)[] = Array.from({ length: WEEK_HOURS + MIN_ERRORS_FOR_BANDS - 1 }, () => 50);
    for (let i = 0; i < 5; i++) mw.push(null);
    const line = weekEarlierLine(mw, WEEK_HOURS + MIN_ERRORS_FOR_BANDS - 1);
    expect(line.mean[mw.length - 1]).toBe(50);
    expect(line.upper80[mw.length - 1]).toBeNull();
  });
});

describe('quantile', () => {
  it('interpolates between order statistics', () => {
    expect(quantile([1, 2, 3, 4], 0.5)).toBe(2.5);
    expect(quantile([1, 2, 3, 4], 0)).toBe(1);
    expect(quantile([1, 2, 3, 4], 1)).toBe(4);
  });
});
