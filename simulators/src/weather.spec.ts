import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { DEMO_STATIONS, HOUR_MS } from '@morrowline/shared';
import { isRestDay, localTime } from './calendar';
import { exportDataSet } from './export';
import { FeedGenerator } from './generator';
import { errorSigma, ForecastIssuer } from './temperature-forecasts';
import { StationWeather } from './weather';

const TZ = 'America/Denver';
const start = Date.parse('2026-01-05T07:00:00Z');

describe('simulated temperature forecasts', () => {
  it('err by a mean absolute error that grows with lead time: about 1.0 °C over the first day, 1.4 over the second, 3.5 over the seventh', () => {
    // Over a year of forecasts, the mean absolute error by lead day against the station's own
    // truth. The expected figures are σ(L)·√(2/π), the mean absolute deviation of a normal
    // distribution (a textbook identity), at the middle of each lead day.
    const weather = new StationWeather(11, start, TZ);
    const issuer = new ForecastIssuer(11, weather, { late: 0, missed: 0 });
    const sums = new Array<number>(8).fill(0);
    const counts = new Array<number>(8).fill(0);
    for (let hour = start; hour < start + 365 * 24 * HOUR_MS; hour += HOUR_MS) {
      for (const f of issuer.issuedIn(hour)) {
        for (const v of f.values) {
          const lead = (Date.parse(v.hour) - f.issuedAt) / HOUR_MS;
          const day = Math.ceil(lead / 24);
          sums[day] += Math.abs(v.tempC - weather.at(Date.parse(v.hour)).get(v.station)!);
          counts[day]++;
        }
      }
      weather.forgetBefore(hour);
    }
    const mae = sums.map((s, i) => s / counts[i]);
    for (const day of [1, 3, 7]) expect(mae[day]).toBeCloseTo(errorSigma(day * 24 - 12) * Math.sqrt(2 / Math.PI), 0);
    // Figures stated in README (measured here, seed 11, one year): day 1 1.00, day 2 1.41, day 3 1.76, day 5 2.59, day 7 3.48 °C.
    expect(mae[1]).toBeGreaterThan(0.9);
    expect(mae[1]).toBeLessThan(1.5);
    for (let day = 2; day <= 7; day++) expect(mae[day]).toBeGreaterThan(mae[day - 1]);
  });

  it('issues twice a day, now and then late or not at all, each value at or after its issue time', () => {
    const weather = new StationWeather(5, start, TZ);
    const issuer = new ForecastIssuer(5, weather);
    const issued: number[] = [];
    for (let hour = start; hour < start + 200 * 24 * HOUR_MS; hour += HOUR_MS) {
      for (const f of issuer.issuedIn(hour)) {
        issued.push(f.issuedAt);
        expect(f.values).toHaveLength(168 * DEMO_STATIONS.length);
        for (const v of f.values) expect(Date.parse(v.hour)).toBeGreaterThan(f.issuedAt);
      }
      weather.forgetBefore(hour);
    }
    expect(issued.length).toBeLessThan(400);
    expect(issued.length).toBeGreaterThan(370);
    const late = issued.filter((t) => new Date(t).getUTCMinutes() === 30 && ![4, 16].includes(new Date(t).getUTCHours()));
    expect(late.length).toBeGreaterThan(5);
  });
});

describe('the simulator\'s calendar', () => {
  it('rests on the seeded public holidays and bridge days, per zone for local events', () => {
    expect(isRestDay(localTime(Date.parse('2026-12-24T19:00:00Z'), TZ), 'MILLRACE')).toBe(true);
    expect(isRestDay(localTime(Date.parse('2026-09-04T19:00:00Z'), TZ), 'HARROW')).toBe(true); // bridge day
    expect(isRestDay(localTime(Date.parse('2026-11-14T19:00:00Z'), TZ), 'LANTERN')).toBe(false); // a local event is not a rest day
    expect(isRestDay(localTime(Date.parse('2026-12-23T19:00:00Z'), TZ), 'MILLRACE')).toBe(false);
  });
});

describe('the weather the generator sends', () => {
  it('sends every station\'s observation each hour and the forecasts issued in it', () => {
    const g = new FeedGenerator([{ code: 'HARROW', peakMw: 300 }], start, 9, TZ);
    let observations = 0;
    let forecasts = 0;
    for (let i = 0; i < 48; i++) {
      g.step();
      const w = g.takeWeather();
      observations += w.observations.length;
      forecasts += w.forecasts.length;
    }
    expect(observations).toBe(48 * DEMO_STATIONS.length);
    expect(forecasts % (168 * DEMO_STATIONS.length)).toBe(0);
    expect(forecasts).toBeGreaterThan(0);
  });
});

describe('--export', () => {
  it('writes byte-identical files for the same seed, and different ones for another seed', () => {
    const root = mkdtempSync(join(tmpdir(), 'morrowline-export-'));
    const files = ['load.csv', 'temperature.csv', 'temperature-forecasts.csv', 'special-days.csv'];
    const run = (name: string, seed: number) => {
      exportDataSet({ dir: join(root, name), zone: 'LANTERN', weeks: 2, seed, from: '2026-01-05' });
      return files.map((f) => readFileSync(join(root, name, f)));
    };
    const a = run('a', 4);
    const b = run('b', 4);
    const c = run('c', 5);
    a.forEach((content, i) => expect(content.equals(b[i])).toBe(true));
    expect(a[0].equals(c[0])).toBe(false);
    const [load, temperature, forecasts] = a.map((content) => content.toString('utf8').trimEnd().split('\n'));
    expect(load[0]).toBe('timestamp,load_mw');
    expect(load).toHaveLength(1 + 2 * 168);
    expect(temperature[0]).toBe('timestamp,temp_c');
    expect(temperature[1]).toMatch(/^2026-01-05T07:00:00Z,-?\d+\.\d$/);
    expect(forecasts[0]).toBe('issued_at,timestamp,temp_c');
    for (const line of forecasts.slice(1)) {
      const [issued, hour] = line.split(',');
      expect(Date.parse(hour)).toBeGreaterThan(Date.parse(issued));
    }
  });
  it('writes the calendar days of the span that apply to the zone', () => {
    const root = mkdtempSync(join(tmpdir(), 'morrowline-export-'));
    // 2025-12-22 for 3 weeks: Winter Eve and Winter Feast (24, 25 Dec; shared/src/demo-weather.ts), the New Year Rest Day (2 Jan)
    exportDataSet({ dir: root, zone: 'LANTERN', weeks: 3, seed: 1, from: '2025-12-22' });
    const lines = readFileSync(join(root, 'special-days.csv'), 'utf8').trimEnd().split('\n');
    expect(lines[0]).toBe('day,kind');
    expect(lines).toContain('2025-12-24,public-holiday');
    expect(lines).toContain('2025-12-25,public-holiday');
    expect(lines).toContain('2026-01-02,public-holiday');
    for (const l of lines.slice(1)) expect(l >= '2025-12-22' && l < '2026-01-12').toBe(true);
  });
});
