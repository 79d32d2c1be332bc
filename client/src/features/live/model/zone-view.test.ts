import type { FeedStatusDto, ReadingSeriesDto, ZoneDto } from '@morrowline/shared';
import { describe, expect, it } from 'vitest';
import { emptyCommittedLine, type CommittedLine } from './committed-line';
import { emptyForecastLine } from './forecast-line';
import { systemView, zoneViews } from './zone-view';

const H = 3_600_000;
const from = Date.parse('2026-12-01T07:00:00Z');
const hours = Array.from({ length: 6 }, (_, i) => new Date(from + i * H).toISOString());
const zone = (code: string, name: string, active = true): ZoneDto => ({
  id: code.length, code, name, timeZone: 'America/Denver', alertThresholdPct: 5, alertConsecutiveHours: 2, gateClosure: '10:00', minPlausibleMw: 0, maxPlausibleMw: 1000, active,
});
const series: ReadingSeriesDto = {
  from: hours[0],
  to: new Date(from + 6 * H).toISOString(),
  hours,
  zones: [
    { zone: 'MILLRACE', mw: [100, 110, 120, 130, null, null], quality: [], lastHour: hours[3], lastReceivedAt: null },
    { zone: 'HARROW', mw: [50, null, 60, 70, null, null], quality: [], lastHour: hours[3], lastReceivedAt: null },
    { zone: 'NEWBURY', mw: [null, null, null, null, null, null], quality: [], lastHour: null, lastReceivedAt: null },
  ],
};
const line = (committed: (number | null)[], basis: CommittedLine['basis']): CommittedLine => ({ ...emptyCommittedLine(6), committed, basis });
const status: FeedStatusDto[] = [{ zone: 'NEWBURY', lastHour: null, lastReceivedAt: null, hoursBehind: null, stale: true }];
// The current hour is index 4: indices 0-3 are over.
const nowHour = from + 4 * H;

describe('the live views', () => {
  const zones = [zone('MILLRACE', 'Millrace'), zone('HARROW', 'Harrow Flats'), zone('NEWBURY', 'Newbury Green')];
  const committed = new Map([
    ['MILLRACE', line([100, 100, 100, 125, 125, 125], ['day-ahead', 'day-ahead', 'day-ahead', 'schedule', 'schedule', 'schedule'])],
    ['HARROW', line([50, 50, 50, 50, 50, 50], ['day-ahead', 'day-ahead', 'day-ahead', 'day-ahead', 'day-ahead', 'day-ahead'])],
  ]);
  const run = { ...emptyForecastLine(6), mean: [null, null, null, null, 140, 150] };
  const views = zoneViews({ series, zones, committed, latestRuns: new Map([['MILLRACE', { line: run, source: 'run' }]]), status, nowHour });

  it('measures a zone’s latest reading against what was committed for that hour, and shows the latest run apart', () => {
    const millrace = views[0];
    expect(millrace.currentMw).toBe(130);
    expect(millrace.committedMw).toBe(125);
    expect(millrace.committedBasis).toBe('schedule');
    expect(millrace.deviationPct).toBeCloseTo(4, 10);
    expect(millrace.nextRunMw).toBe(140);
  });

  it('leaves a zone silent for a day out of the total, with its last hour', () => {
    const long = Array.from({ length: 40 }, (_, i) => new Date(from + i * H).toISOString());
    const quiet: ReadingSeriesDto = {
      from: long[0], to: new Date(from + 40 * H).toISOString(), hours: long,
      zones: [
        { zone: 'MILLRACE', mw: long.map((_, i) => (i < 39 ? 100 : null)), quality: [], lastHour: long[38], lastReceivedAt: null },
        { zone: 'HARROW', mw: long.map((_, i) => (i < 3 ? 50 : null)), quality: [], lastHour: long[2], lastReceivedAt: null },
      ],
    };
    const quietStatus: FeedStatusDto[] = [{ zone: 'HARROW', lastHour: long[2], lastReceivedAt: null, hoursBehind: 36, stale: true }];
    const perZone = zoneViews({ series: quiet, zones: zones.slice(0, 2), committed: new Map(), latestRuns: new Map(), status: quietStatus, nowHour: from + 39 * H });
    const system = systemView({ views: perZone, series: quiet, inactive: [], nowHour: from + 39 * H });
    expect(system.leftOut).toEqual([{ name: 'Harrow Flats', reason: 'silent', lastHour: long[2] }]);
    expect(system.currentMw).toBe(100);
    expect(system.incomplete.some(Boolean)).toBe(false);
  });

  it('leaves a zone that never reported and a switched-off zone out of the system total, naming them', () => {
    const system = systemView({ views, series, inactive: [zone('OLDMILL', 'Old Mill', false)], nowHour });
    expect(system.actual).toEqual([150, null, 180, 200, null, null]);
    expect(system.incomplete).toEqual([false, true, false, false, false, false]);
    expect(system.leftOut).toEqual([
      { name: 'Newbury Green', reason: 'never-reported' },
      { name: 'Old Mill', reason: 'switched-off' },
    ]);
    expect(system.currentMw).toBe(200);
    expect(system.committedMw).toBe(175);
    expect(system.committedBasis).toBe('mixed');
  });
});
