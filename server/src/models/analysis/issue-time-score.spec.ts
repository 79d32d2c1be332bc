import { scoreAtIssueTimes, type ScoredDay } from './issue-time-score';
import type { StoredModel } from '../stored-model';

const WEEK = 168;
/** Five weeks of a daily shape that steps up 10 MW each week: a week-earlier forecast is 10 MW low. */
function stepping(weeks = 5): Float64Array {
  return Float64Array.from({ length: weeks * WEEK }, (_, t) => 100 + (t % 24) + 10 * Math.floor(t / WEEK));
}
/** The last day of the series, issued at 09:00 the day before (the hours up to 09:00 had ended). */
const lastDay = (n: number): ScoredDay => ({ dayStart: n - 24, hours: 24, cut: n - 24 - 15 });
const weekly = (ar: number[] = []): StoredModel => ({ diff: [168], p: ar.length, q: 0, ar, ma: [], sigma2: 4, mean: 0 });

describe('scoring versions at their issue times', () => {
  it('re-forecasts with the coefficients held: (1−B^168) with no ARMA terms forecasts last week, 10 MW low', () => {
    const values = stepping();
    const day = lastDay(values.length);
    const r = scoreAtIssueTimes({ values, excluded: [], days: [day], versions: [{ model: weekly(), issued: [null] }] });
    // actuals are 140 + hour of day; each forecast is 10 MW lower
    const expected = (100 / 24) * Array.from({ length: 24 }, (_, h) => 10 / (140 + h)).reduce((a, b) => a + b, 0);
    expect(r.versions[0].mape).toBeCloseTo(expected, 9);
    expect(r.versions[0].bias).toBeCloseTo(-10, 9);
    expect(r.versions[0].perDay[0]).toMatchObject({ source: 're-forecast', hours: 24 });
    // the same hour a week earlier is the same forecast here
    expect(r.baseline.mape).toBeCloseTo(expected, 9);
  });

  it('scores the forecast a version issued where one is stored, band coverage included', () => {
    const values = stepping();
    const day = lastDay(values.length);
    const actual = Array.from({ length: 24 }, (_, h) => 140 + h);
    const issued = {
      mean: actual.map((a) => a * 1.05),
      // the band holds the actual on the first 6 hours only
      lower80: actual.map((a, h) => (h < 6 ? a - 1 : a + 1)),
      upper80: actual.map((a) => a + 20),
    };
    const r = scoreAtIssueTimes({ values, excluded: [], days: [day], versions: [{ model: weekly(), issued: [issued] }] });
    expect(r.versions[0].mape).toBeCloseTo(5, 9);
    expect(r.versions[0].coverage80).toBeCloseTo(25, 9);
    expect(r.versions[0].perDay[0].source).toBe('issued');
  });

  it('two versions with the same orders and different coefficients score differently', () => {
    const values = stepping();
    // a disturbance on the morning before the issue time, which an AR term carries forward
    for (let t = values.length - 24 - 30; t < values.length - 24 - 15; t++) values[t] += 25;
    const day = lastDay(values.length);
    const r = scoreAtIssueTimes({ values, excluded: [], days: [day], versions: [{ model: weekly([0.9]), issued: [null] }, { model: weekly([0.1]), issued: [null] }] });
    expect(r.versions[0].mape).not.toBeNull();
    expect(Math.abs((r.versions[0].mape as number) - (r.versions[1].mape as number))).toBeGreaterThan(0.01);
  });

  it('uses only the hours that had ended at the issue time', () => {
    const values = stepping();
    const day = lastDay(values.length);
    const before = scoreAtIssueTimes({ values, excluded: [], days: [day], versions: [{ model: weekly([0.8]), issued: [null] }] });
    const changed = Float64Array.from(values);
    for (let t = day.cut; t < day.dayStart; t++) changed[t] += 50;
    const after = scoreAtIssueTimes({ values: changed, excluded: [], days: [day], versions: [{ model: weekly([0.8]), issued: [null] }] });
    expect(after.versions[0].mape).toBe(before.versions[0].mape);
  });

  it('leaves excluded and missing hours out of the score, the same hours for every version', () => {
    const values = stepping();
    const day = lastDay(values.length);
    values[day.dayStart + 3] = NaN;
    const r = scoreAtIssueTimes({ values, excluded: [day.dayStart + 4, day.dayStart + 5], days: [day], versions: [{ model: weekly(), issued: [null] }, { model: weekly([0.5]), issued: [null] }] });
    expect(r.scoredHours).toEqual([21]);
    expect(r.versions.map((v) => v.hours)).toEqual([21, 21]);
  });

  it('says so when a day cannot be forecast (no history before the issue time)', () => {
    const values = stepping();
    const r = scoreAtIssueTimes({ values, excluded: [], days: [{ dayStart: 24, hours: 24, cut: 0 }], versions: [{ model: weekly(), issued: [null] }] });
    expect(r.versions[0].perDay[0]).toEqual({ source: null, hours: 0, mape: null });
    expect(r.versions[0].days).toBe(0);
  });
});
