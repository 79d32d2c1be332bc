import { dayVintages } from './day-vintages';

const H = 3_600_000;
const from = Date.UTC(2026, 10, 2, 7); // the day's first hour
const to = from + 24 * H;
/** values of one station: issued at `issued`, for `count` hours from `first` */
const vintage = (issued: number, first: number, count: number, stationId = 1) => Array.from({ length: count }, (_, k) => ({ stationId, issuedAt: issued, hourStart: first + k * H, tempC: 3 }));

describe('dayVintages', () => {
  const d1 = from - 26 * H; // issued the morning before the day before
  const d2 = from - 2 * H; // issued the morning before the day
  const d3 = from + 22 * H; // issued during the day: covers its last hours only
  const values = [...vintage(d1, d1 + H, 72), ...vintage(d2, d2 + H, 72), ...vintage(d2, d2 + H, 72, 2), ...vintage(d3, d3 + H, 72)];

  it('lists the issue times covering the day newest first, with the hours of the day each covers', () => {
    expect(dayVintages(values, from, to, null).map((v) => [v.issuedAt, v.hours])).toEqual([
      [d3, 1],
      [d2, 24],
      [d1, 24],
    ]);
  });

  it('marks the newest vintage issued by the forecast\'s issue time as the one it used', () => {
    expect(dayVintages(values, from, to, d2 + 30 * 60_000).map((v) => v.usedByForecast)).toEqual([false, true, false]);
    // issued the very millisecond the vintage was: it was known
    expect(dayVintages(values, from, to, d1).map((v) => v.usedByForecast)).toEqual([false, false, true]);
    expect(dayVintages(values, from, to, d1 - 1).some((v) => v.usedByForecast)).toBe(false);
  });

  it('leaves out vintages that cover none of the day', () => {
    expect(dayVintages(vintage(d1, d1 + H, 24), from, to, null)).toEqual([]);
  });
});
