import { localTime } from './calendar';
import { HOUR_MS } from '@morrowline/shared';
import { FeedGenerator, type SimReading } from './generator';
import { expectedLoadMw } from './load-model';
import { parseOptions } from './options';

const ZONES = [
  { code: 'MILLRACE', peakMw: 260 },
  { code: 'COPPERLINE', peakMw: 340 },
  { code: 'HARROW', peakMw: 300 },
  { code: 'QUARRY', peakMw: 150 },
  { code: 'LANTERN', peakMw: 220 },
];
const TZ = 'America/Denver';
const start = Date.parse('2026-06-01T06:00:00Z'); // local midnight, a Monday

function generate(seed: number, hours: number): SimReading[] {
  const g = new FeedGenerator(ZONES, start, seed, TZ);
  const out: SimReading[] = [];
  for (let i = 0; i < hours; i++) out.push(...g.step());
  return out;
}

describe('the load model', () => {
  const at = (iso: string, tempC: number, holiday = false) => ({ t: localTime(Date.parse(iso), TZ), tempC, holiday });

  it('runs the smelter harder during its shifts than at night', () => {
    expect(expectedLoadMw('COPPERLINE', 340, at('2026-06-03T16:00:00Z', 20))).toBeGreaterThan(expectedLoadMw('COPPERLINE', 340, at('2026-06-03T09:00:00Z', 20)) * 1.2);
  });

  it('fills the commercial centre on a weekday, not on a Sunday or a holiday', () => {
    const weekday = expectedLoadMw('LANTERN', 220, at('2026-06-03T18:00:00Z', 22));
    expect(weekday).toBeGreaterThan(expectedLoadMw('LANTERN', 220, at('2026-06-07T18:00:00Z', 22)) * 1.5);
    expect(weekday).toBeGreaterThan(expectedLoadMw('LANTERN', 220, at('2026-06-03T18:00:00Z', 22, true)) * 1.5);
  });

  it('answers heat with air-conditioning in the suburb far more than in the old town', () => {
    const rise = (zone: string) => expectedLoadMw(zone, 300, at('2026-07-15T23:00:00Z', 36)) / expectedLoadMw(zone, 300, at('2026-07-15T23:00:00Z', 22));
    expect(rise('HARROW')).toBeGreaterThan(1.4);
    expect(rise('HARROW')).toBeGreaterThan(rise('MILLRACE') + 0.2);
  });

  it('runs irrigation pumps on summer days only', () => {
    expect(expectedLoadMw('QUARRY', 150, at('2026-07-15T19:00:00Z', 28))).toBeGreaterThan(expectedLoadMw('QUARRY', 150, at('2026-03-15T19:00:00Z', 28)) * 1.5);
  });
});

describe('the feed generator', () => {
  it('is deterministic for a seed and differs between seeds', () => {
    expect(generate(7, 500)).toEqual(generate(7, 500));
    expect(generate(7, 500)).not.toEqual(generate(8, 500));
  });

  it('sends on-the-hour readings within the plausible range, with gaps, repeats and corrections', () => {
    const readings = generate(3, 24 * 7 * 8);
    for (const r of readings) {
      expect(Date.parse(r.hour) % HOUR_MS).toBe(0);
      const peak = ZONES.find((z) => z.code === r.zone)!.peakMw;
      expect(r.mw).toBeGreaterThanOrEqual(0);
      expect(r.mw).toBeLessThan(peak * 1.8);
    }
    const keys = readings.map((r) => `${r.zone}|${r.hour}`);
    const distinct = new Set(keys);
    expect(distinct.size).toBeLessThan(ZONES.length * 24 * 7 * 8); // dropouts
    expect(distinct.size).toBeGreaterThan(ZONES.length * 24 * 7 * 8 * 0.95);
    expect(keys.length).toBeGreaterThan(distinct.size); // repeats
    expect(readings.some((r) => r.quality === 'estimated')).toBe(true); // corrections
  });

  it('dips during an outage', () => {
    const g = new FeedGenerator([{ code: 'MILLRACE', peakMw: 260 }], start, 5, TZ, { dropout: 0, outage: 1, late: 0, repeat: 0, correction: 0 });
    const calm = new FeedGenerator([{ code: 'MILLRACE', peakMw: 260 }], start, 5, TZ, { dropout: 0, outage: 0, late: 0, repeat: 0, correction: 0 });
    const dipped = g.step()[0].mw;
    const normal = calm.step()[0].mw;
    expect(dipped).toBeLessThan(normal * 0.75);
  });

  it('sends a reading only after its hour has ended, late ones later', () => {
    const g = new FeedGenerator(ZONES, start, 11, TZ);
    for (let i = 0; i < 300; i++) {
      const hour = g.hour;
      for (const r of g.step()) expect(Date.parse(r.hour)).toBeLessThanOrEqual(hour);
    }
  });
});

describe('options', () => {
  it('reads the options and their defaults', () => {
    expect(parseOptions([], { MORROWLINE_FEED_KEY: 'k' })).toMatchObject({ key: 'k', speed: 1, lagHours: 0, backfillWeeks: 4, once: false });
    expect(parseOptions(['--speed', '3600', '--zones', 'millrace,harrow', '--once'], {})).toMatchObject({ speed: 3600, lagHours: 48, zones: ['MILLRACE', 'HARROW'], once: true });
  });

  it('refuses nonsense with a clear message', () => {
    expect(() => parseOptions(['--speed', 'fast'], {})).toThrow(/--speed must be a number/);
    expect(() => parseOptions(['--zones', 'ATLANTIS'], {})).toThrow(/not a demo zone: ATLANTIS/);
    expect(() => parseOptions(['--colour'], {})).toThrow();
  });
});
