import { plainCalendar } from '@morrowline/engine';
import { responseChange, storedResponse, whatIfHours } from './weather-what-if';

const terms = { temperature: true, recency: false, calendar: true, heatBelow: 14, coolAbove: 20 };
// heating 30 MW/°C at night (local 0–5), 20 in the other parts; cooling 12 everywhere; a holiday dummy
const response = [
  { name: 'hdd_night', value: 30, se: 1 },
  ...['morning', 'afternoon', 'evening'].map((p) => ({ name: `hdd_${p}`, value: 20, se: 1 })),
  ...['night', 'morning', 'afternoon', 'evening'].map((p) => ({ name: `cdd_${p}`, value: 12, se: 1 })),
  { name: 'holiday_morning', value: -90, se: 5 },
];

describe('the load another temperature path would mean, from a stored response', () => {
  it('rebuilds the engine response with zero for the coefficients not stored', () => {
    const r = storedResponse({ terms, response });
    expect(r.names).toContain('bridge');
    expect(r.beta[r.names.indexOf('bridge')]).toBe(0);
    expect(r.estimated[r.names.indexOf('bridge')]).toBe(false);
    expect(r.beta[r.names.indexOf('hdd_night')]).toBe(30);
  });

  it('changes each hour by β of its part of the day times the change of its degree term (hand-computed)', () => {
    const cal = plainCalendar(24);
    const base = Float64Array.from({ length: 24 }, (_, h) => (h < 12 ? 10 : 22)); // heating 4 °C before noon, cooling 2 °C after
    const colder = base.map((t) => t - 2);
    const d = responseChange({ terms, response }, base, colder, cal, 0, 24);
    expect(d[3]).toBeCloseTo(30 * 2, 10); // night: 2 more heating degrees
    expect(d[8]).toBeCloseTo(20 * 2, 10); // morning
    expect(d[15]).toBeCloseTo(-12 * 2, 10); // afternoon: 2 fewer cooling degrees (22 → 20)
    expect(d[20]).toBeCloseTo(-12 * 2, 10);
    // between the thresholds nothing moves
    const mild = Float64Array.from({ length: 24 }, () => 17);
    expect(Array.from(responseChange({ terms, response }, mild, mild.map((t) => t + 2), cal, 0, 24)).every((v) => v === 0)).toBe(true);
  });
});

describe('whatIfHours', () => {
  it('gives one add per hour of the operating day with a change of 0.1 MW or more, rounded to 0.1 MW, at its position from the day\'s start', () => {
    const dayStart = Date.UTC(2026, 10, 2, 7);
    const at = (k: number) => new Date(dayStart + k * 3_600_000).toISOString();
    const hour = (k: number, changeMw: number | null) => ({ hourStart: at(k), modelMw: 500, temperatureC: 3, whatIfTemperatureC: 1, whatIfMw: changeMw === null ? null : 500 + changeMw, changeMw });
    expect(whatIfHours({ hours: [hour(0, 50.04), hour(1, 0.04), hour(2, null), hour(3, -12.36), hour(24, 3)] }, dayStart)).toEqual([
      { hour: 0, value: 50 },
      { hour: 3, value: -12.4 },
      // a 25-hour day's last hour
      { hour: 24, value: 3 },
    ]);
  });
});
