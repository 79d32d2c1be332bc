/** fit and backtest with --temperature on files written from the synthetic zone (engine weather/synthetic-zone). */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { syntheticZone } from '@morrowline/engine';
import { runBacktest } from './backtest';
import { runFit } from './fit';

const START = Date.parse('2026-01-05T07:00:00Z');
const iso = (ms: number) => new Date(ms).toISOString().replace('.000Z', 'Z');

function files(): { load: string; temperature: string; forecasts: string; calendar: string } {
  const dir = mkdtempSync(join(tmpdir(), 'weather-cli-'));
  const z = syntheticZone(9 * 168, 3, { holidays: [30] });
  const at = (i: number) => iso(START + i * 3_600_000);
  const load = ['timestamp,load_mw', ...Array.from(z.load, (v, i) => `${at(i)},${v.toFixed(3)}`)];
  const temperature = ['timestamp,temp_c', ...Array.from(z.temperature, (v, i) => `${at(i)},${v.toFixed(1)}`)];
  const forecasts = ['issued_at,timestamp,temp_c'];
  for (const v of z.vintages)
    v.members[0].forEach((t, j) => {
      if (Number.isFinite(t)) forecasts.push(`${iso(START + v.issued * 3_600_000)},${at(v.first + j)},${t.toFixed(1)}`);
    });
  const calendar = ['day,kind', '2026-02-04,public-holiday']; // day 30 from 2026-01-05
  const out = { load: join(dir, 'load.csv'), temperature: join(dir, 'temperature.csv'), forecasts: join(dir, 'forecasts.csv'), calendar: join(dir, 'calendar.csv') };
  writeFileSync(out.load, load.join('\n') + '\n');
  writeFileSync(out.temperature, temperature.join('\n') + '\n');
  writeFileSync(out.forecasts, forecasts.join('\n') + '\n');
  writeFileSync(out.calendar, calendar.join('\n') + '\n');
  return out;
}

describe('command line with weather', () => {
  const f = files();
  const weather = ['--temperature', f.temperature, '--temperature-forecasts', f.forecasts, '--calendar', f.calendar, '--time-zone', 'America/Denver'];
  it('backtest --json keeps mape and baseline.mape at the top level and adds perfectWeather.mape', () => {
    const j = runBacktest(['--input', f.load, ...weather, '--days', '2', '--issue-hour', '10', '--json']).json as Record<string, unknown> & { baseline: { mape: number }; perfectWeather: { mape: number }; days: unknown[] };
    expect(Number.isFinite(j.mape as number)).toBe(true);
    expect(Number.isFinite(j.baseline.mape)).toBe(true);
    expect(Number.isFinite(j.perfectWeather.mape)).toBe(true);
    expect(j.days).toHaveLength(2);
  });
  it('backtest without temperature has no perfectWeather', () => {
    const j = runBacktest(['--input', f.load, '--days', '1', '--method', 'seasonal-naive', '--json']).json;
    expect(j).not.toHaveProperty('perfectWeather');
  });
  it('fit --temperature prints the response coefficients with standard errors beside the error model', () => {
    const j = runFit(['--input', f.load, ...weather, '--json']).json as { response: Array<{ name: string; value: number; se: number }>; coefficients: Array<{ se: number }>; model: string };
    expect(j.model).toMatch(/temperature/);
    const hdd = j.response.filter((c) => c.name.startsWith('hdd_'));
    expect(hdd.length).toBeGreaterThan(0);
    // the synthetic zone's heating response is 12 MW per degree below 14 °C
    for (const c of hdd.filter((x) => !x.name.includes('mean24') && !x.name.includes('lag3'))) expect(Math.abs(c.value - 12)).toBeLessThan(4);
    expect(j.coefficients.every((c) => Number.isFinite(c.se))).toBe(true);
  });
  it('refuses weather files without --temperature, and names the file and line of a bad one', () => {
    expect(() => runBacktest(['--input', f.load, '--temperature-forecasts', f.forecasts])).toThrow('--temperature-forecasts and --calendar need --temperature');
    const bad = join(mkdtempSync(join(tmpdir(), 'weather-cli-')), 'bad.csv');
    writeFileSync(bad, 'timestamp,temp_c\n2026-01-05T07:00:00Z,hot\n');
    expect(() => runBacktest(['--input', f.load, '--temperature', bad])).toThrow(`--temperature ${bad}: line 2: temperature "hot" is not a number`);
    expect(() => runBacktest(['--input', f.load, ...weather.slice(0, 2), '--time-zone', 'Mars/Olympus'])).toThrow('--time-zone "Mars/Olympus" is not an IANA time zone');
  });
});
