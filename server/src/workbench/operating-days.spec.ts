import { operatingDayStarts } from './operating-days';

describe('operating-day starts in a zone with daylight saving', () => {
  it('gives a 23-hour day in spring and a 25-hour day in autumn (America/Denver)', () => {
    // 2026-03-06T07:00Z is local midnight (MST, UTC−7); DST starts 2026-03-08
    const spring = operatingDayStarts(Date.parse('2026-03-06T07:00:00Z'), 24 * 4, 'America/Denver');
    expect(spring.dates.slice(0, 4)).toEqual(['2026-03-06', '2026-03-07', '2026-03-08', '2026-03-09']);
    expect(spring.starts.slice(1, 4).map((s, i) => s - spring.starts[i])).toEqual([24, 24, 23]);
    const autumn = operatingDayStarts(Date.parse('2026-10-31T06:00:00Z'), 24 * 3, 'America/Denver');
    expect(autumn.starts.slice(1).map((s, i) => s - autumn.starts[i])).toEqual([24, 25]);
  });

  it('starts at the first local midnight inside the series', () => {
    const r = operatingDayStarts(Date.parse('2026-01-10T15:00:00Z'), 48, 'America/Denver');
    expect(r.starts[0]).toBe(16); // 2026-01-11T07:00Z, 16 hours after 15:00Z
    expect(r.dates[0]).toBe('2026-01-11');
  });
});
