import { HOUR_MS } from '@morrowline/shared';
import { excludedHourSet } from './outage-hours';

describe('outage hours', () => {
  const t0 = Date.UTC(2026, 10, 30, 0);

  it('covers every hour a window touches, rounded out to whole hours', () => {
    const set = excludedHourSet([{ start: t0 + 1.5 * HOUR_MS, end: t0 + 3.25 * HOUR_MS }], t0, t0 + 24 * HOUR_MS);
    expect([...set].map((h) => (h - t0) / HOUR_MS)).toEqual([1, 2, 3]);
  });

  it('cuts windows to the range asked for and runs an open window up to the limit', () => {
    const set = excludedHourSet([{ start: t0 - 5 * HOUR_MS, end: null }], t0, t0 + 24 * HOUR_MS, t0 + 2 * HOUR_MS);
    expect([...set].map((h) => (h - t0) / HOUR_MS)).toEqual([0, 1]);
  });

  it('merges overlapping windows without counting an hour twice', () => {
    const set = excludedHourSet(
      [
        { start: t0, end: t0 + 3 * HOUR_MS },
        { start: t0 + 2 * HOUR_MS, end: t0 + 4 * HOUR_MS },
      ],
      t0,
      t0 + 24 * HOUR_MS,
    );
    expect(set.size).toBe(4);
  });
});
