import { DEMO_STATIONS, DEMO_ZONE_STATIONS, demoSpecialDays } from './demo-weather';
import { DEMO_ZONES } from './demo-scenario';
import { weightedTemperature } from './weather';

describe('the demo weather and calendar', () => {
  it('gives every demo zone stations that exist, with weights that sum to one', () => {
    const codes = new Set(DEMO_STATIONS.map((s) => s.code));
    for (const zone of DEMO_ZONES) {
      const stations = DEMO_ZONE_STATIONS[zone.code];
      expect(stations.length).toBeGreaterThan(0);
      for (const s of stations) expect(codes.has(s.station)).toBe(true);
      expect(stations.reduce((sum, s) => sum + s.weight, 0)).toBeCloseTo(1, 10);
    }
  });

  it('lists the public holidays, a bridge day beside a Tuesday or Thursday holiday, and local events', () => {
    // 2026: 14 March is a Saturday, 3 September a Thursday (bridge Friday 4th), 16 October a
    // Friday, 24 and 25 December a Thursday and Friday (the Friday is a holiday: no bridge day).
    const days = demoSpecialDays(2026);
    expect(days.filter((d) => d.kind === 'public-holiday')).toHaveLength(9);
    expect(days.filter((d) => d.kind === 'bridge-day').map((d) => d.day)).toEqual(expect.arrayContaining(['2026-09-04']));
    expect(days.some((d) => d.kind === 'bridge-day' && d.day === '2026-12-26')).toBe(false);
    expect(days.find((d) => d.name === 'Lanternside Lantern Walk')).toMatchObject({ day: '2026-11-14', kind: 'local-event', zones: ['LANTERN'] });
    expect(days.map((d) => d.day)).toEqual([...days.map((d) => d.day)].sort());
  });
});

describe('a zone temperature from its stations', () => {
  it('is the weighted average, and nothing when a weighted station has no value', () => {
    expect(weightedTemperature([10, 20], [0.6, 0.4])).toBeCloseTo(14, 10);
    expect(weightedTemperature([10, null], [0.5, 0.5])).toBeNull();
    expect(weightedTemperature([], [])).toBeNull();
  });
});
