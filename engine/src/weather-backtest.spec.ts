/**
 * The backtest never peeks: an origin's forecast is the same when everything issued or observed
 * after its issue time is corrupted (vintages issued later, temperatures and loads of later hours).
 */
import { weatherBacktest } from './weather-backtest';
import { syntheticZone } from './weather/synthetic-zone';
import { TemperatureVintage } from './weather/vintages';

describe('weather backtest', () => {
  const hours = 9 * 168 + 24;
  const z = syntheticZone(hours, 5, { holidays: [20, 45] });
  const calendar = { hourOfDay: z.hourOfDay, holiday: z.holiday, bridge: new Uint8Array(z.holiday.length) };
  const run = (load: Float64Array, temperature: Float64Array, vintages: TemperatureVintage[]) =>
    weatherBacktest(load, { days: 2, issueHour: 10, temperature, vintages, calendar, reselectEveryDays: 1 });
  it('an origin’s forecast is unchanged when every vintage issued after it, and every later reading, is corrupted', () => {
    const clean = run(z.load, z.temperature, z.vintages);
    const last = clean.days[clean.days.length - 1];
    const origin = last.origin;
    const load = Float64Array.from(z.load, (v, t) => (t >= origin ? 9999 : v));
    const temperature = Float64Array.from(z.temperature, (v, t) => (t >= origin ? 55 : v));
    const vintages = z.vintages.map((v) => (v.issued > origin ? { ...v, members: v.members.map((m) => new Float64Array(m.length).fill(-50)) } : v));
    const corrupted = run(load, temperature, vintages);
    const after = corrupted.days[corrupted.days.length - 1];
    expect(after.origin).toBe(origin);
    expect(after.forecast.mean).toEqual(last.forecast.mean);
    expect(after.forecast.lower95).toEqual(last.forecast.lower95);
    expect(after.forecast.upper95).toEqual(last.forecast.upper95);
    // the check can fail: a vintage issued after the origin exists and would change the forecast if it were read
    expect(z.vintages.some((v) => v.issued > origin && v.first < origin + 38)).toBe(true);
  });
  it('reports the model, the baseline and perfect weather over the same days', () => {
    const r = run(z.load, z.temperature, z.vintages);
    expect(r.days).toHaveLength(2);
    for (const k of ['mape', 'coverage95'] as const) {
      expect(Number.isFinite(r[k])).toBe(true);
      expect(Number.isFinite(r.baseline[k])).toBe(true);
      expect(Number.isFinite(r.perfectWeather[k])).toBe(true);
    }
    expect(r.days.every((d) => d.origin === d.dayStart - 14)).toBe(true); // 10:00 the day before
  });
});
