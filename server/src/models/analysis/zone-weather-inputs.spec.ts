import type { SpecialDayDto } from '@morrowline/shared';
import { zoneWeatherInputs, type ZoneWeatherRows } from './zone-weather-inputs';

const H = 3_600_000;
// 2026-03-07T00:00Z is Friday 17:00 in Denver (MST, UTC−7); daylight time starts Sunday 2026-03-08 at 02:00
const FIRST = Date.UTC(2026, 2, 7, 0);

function rows(changes: Partial<ZoneWeatherRows> = {}): ZoneWeatherRows {
  return { zone: 'QUARRY', timeZone: 'America/Denver', firstHourMs: FIRST, hours: 72, horizon: 24, stationIds: [1, 2], weights: [3, 1], observed: [], forecasts: [], specialDays: [], ...changes };
}

describe('a zone\'s weather on its load\'s timeline', () => {
  it('weights the stations\' observed temperatures and leaves an hour a station lacks missing', () => {
    const r = zoneWeatherInputs(
      rows({
        observed: [
          { stationId: 1, hourStart: FIRST, tempC: 10 },
          { stationId: 2, hourStart: FIRST, tempC: 2 },
          { stationId: 1, hourStart: FIRST + H, tempC: 10 },
        ],
      }),
    );
    expect(r.temperature[0]).toBe(8); // (3·10 + 1·2) / 4
    expect(r.temperature[1]).toBeNaN();
    expect(r.observedHours).toBe(1);
  });

  it('makes one vintage per issue time from the values issued by then, with its issue time in hours of the timeline', () => {
    const issued1 = FIRST + 5.5 * H;
    const issued2 = FIRST + 29.5 * H;
    const r = zoneWeatherInputs(
      rows({
        forecasts: [
          { stationId: 1, issuedAt: issued1, hourStart: FIRST + 10 * H, tempC: 4 },
          { stationId: 2, issuedAt: issued1, hourStart: FIRST + 10 * H, tempC: 8 },
          { stationId: 1, issuedAt: issued1, hourStart: FIRST + 12 * H, tempC: 6 },
          { stationId: 2, issuedAt: issued1, hourStart: FIRST + 12 * H, tempC: 6 },
          // the second issue is station 1's only: station 2 keeps its value issued earlier
          { stationId: 1, issuedAt: issued2, hourStart: FIRST + 12 * H, tempC: 10 },
        ],
      }),
    );
    expect(r.vintages).toHaveLength(2);
    expect(r.vintages[0].issued).toBe(5.5);
    expect(r.vintages[0].first).toBe(10);
    expect(Array.from(r.vintages[0].members[0])).toEqual([5, NaN, 6]);
    expect(r.vintages[1].issued).toBe(29.5);
    expect(r.vintages[1].first).toBe(12);
    expect(Array.from(r.vintages[1].members[0])).toEqual([9]); // (3·10 + 1·6) / 4
  });

  it('sets local hours, weekdays and the zone\'s special days across the change to daylight time', () => {
    const days: SpecialDayDto[] = [
      { id: 1, day: '2026-03-09', name: 'Valley day', kind: 'public-holiday', zones: [] },
      { id: 2, day: '2026-03-10', name: 'Bridge', kind: 'bridge-day', zones: ['QUARRY'] },
      { id: 3, day: '2026-03-07', name: 'Elsewhere', kind: 'public-holiday', zones: ['OTHER'] },
      { id: 4, day: '2026-03-08', name: 'Fair', kind: 'local-event', zones: [] },
    ];
    const r = zoneWeatherInputs(rows({ specialDays: days }));
    const c = r.calendar;
    expect(c.hourOfDay[0]).toBe(17);
    expect(c.weekday![0]).toBe(5); // Friday
    // Sunday 2026-03-08 09:00Z is 02:00 MST → 03:00 MDT
    const i = (Date.UTC(2026, 2, 8, 9) - FIRST) / H;
    expect(c.hourOfDay[i - 1]).toBe(1);
    expect(c.hourOfDay[i]).toBe(3);
    expect(c.weekday![i]).toBe(0);
    // Monday 2026-03-09 00:00 MDT = 06:00Z
    const monday = (Date.UTC(2026, 2, 9, 6) - FIRST) / H;
    expect([c.holiday[monday - 1], c.holiday[monday], c.holiday[monday + 23], c.holiday[monday + 24]]).toEqual([0, 1, 1, 0]);
    expect([c.bridge[monday + 23], c.bridge[monday + 24]]).toEqual([0, 1]);
    expect(Array.from(c.holiday).slice(0, 8).every((h) => h === 0)).toBe(true);
    expect(c.hourOfDay.length).toBe(96);
  });
});
