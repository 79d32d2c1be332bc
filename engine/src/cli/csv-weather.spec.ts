/** The weather and calendar readers refuse what cannot be right, naming the line and the fault. */
import { parseCalendarCsv, parseTemperatureCsv, parseTemperatureForecastCsv } from './csv-weather';

const START = Date.parse('2026-01-05T07:00:00Z');

describe('temperature file', () => {
  it('places rows on the load timeline and leaves absent hours missing', () => {
    const t = parseTemperatureCsv('timestamp,temp_c\n2026-01-05T07:00:00Z,-3.5\n2026-01-05T02:00:00-07:00,1\n2026-01-05T10:00:00Z,2\n2026-01-06T10:00:00Z,9\n', START, 4);
    expect(Array.from(t)).toEqual([-3.5, NaN, 1, 2]); // 02:00−07:00 is 09:00Z, the third hour; the last row is after the timeline's end
  });
  it.each([
    ['time,temp\n', 'line 1: header must be "timestamp,temp_c", found "time,temp"'],
    ['timestamp,temp_c\n', 'line 2: no data rows after the header'],
    ['timestamp,temp_c\n2026-01-05T07:00:00Z,warm\n', 'line 2: temperature "warm" is not a number'],
    ['timestamp,temp_c\n2026-01-05T07:00:00Z,61\n', 'line 2: temperature 61 °C is outside −60..60 °C'],
    ['timestamp,temp_c\n2026-01-05T07:30:00Z,1\n', 'line 2: timestamp "2026-01-05T07:30:00Z" is not the start of an hour'],
    ['timestamp,temp_c\n2026-01-05T07:00:00,1\n', 'line 2: timestamp: timestamp "2026-01-05T07:00:00" is not ISO 8601 with an offset or Z'],
    ['timestamp,temp_c\n2026-01-05T07:00:00Z,1\n2026-01-05T00:00:00-07:00,2\n', 'line 3: duplicate hour 2026-01-05T00:00:00-07:00'],
    ['timestamp,temp_c\n2026-01-05T07:00:00Z,1,2\n', 'line 2: expected 2 fields (timestamp,temp_c), found 3'],
  ])('%j is refused', (text, message) => {
    expect(() => parseTemperatureCsv(text, START, 10)).toThrow(message);
  });
});

describe('temperature forecast file', () => {
  it('reads vintages with and without members', () => {
    expect(parseTemperatureForecastCsv('issued_at,timestamp,temp_c\n2026-01-05T04:30:00Z,2026-01-05T05:00:00Z,1.5\n')).toEqual([
      { issuedMs: Date.parse('2026-01-05T04:30:00Z'), hourMs: Date.parse('2026-01-05T05:00:00Z'), tempC: 1.5 },
    ]);
    const m = parseTemperatureForecastCsv('issued_at,timestamp,temp_c,member\n2026-01-05T04:30:00Z,2026-01-05T05:00:00Z,1.5,e1\n2026-01-05T04:30:00Z,2026-01-05T05:00:00Z,2.5,e2\n');
    expect(m.map((r) => r.member)).toEqual(['e1', 'e2']);
  });
  it.each([
    ['issued_at,timestamp\n', 'line 1: header must be "issued_at,timestamp,temp_c" or "issued_at,timestamp,temp_c,member"'],
    ['issued_at,timestamp,temp_c\n2026-01-05T06:30:00Z,2026-01-05T05:00:00Z,1\n', 'line 2: the forecast for 2026-01-05T05:00:00Z was issued after that hour ended (2026-01-05T06:30:00Z)'],
    ['issued_at,timestamp,temp_c\n2026-01-05T04:30:00Z,2026-01-22T05:00:00Z,1\n', 'line 2: the forecast for 2026-01-22T05:00:00Z is more than 16 days ahead of its issue time'],
    ['issued_at,timestamp,temp_c\n2026-01-05T04:30:00Z,2026-01-05T05:00:00Z,1\n2026-01-05T04:30:00Z,2026-01-05T05:00:00Z,2\n', 'line 3: duplicate forecast for issue 2026-01-05T04:30:00Z, hour 2026-01-05T05:00:00Z'],
    ['issued_at,timestamp,temp_c,member\n2026-01-05T04:30:00Z,2026-01-05T05:00:00Z,1,\n', 'line 2: member is empty'],
    ['issued_at,timestamp,temp_c\n2026-02-30T04:30:00Z,2026-03-01T05:00:00Z,1\n', 'line 2: issued_at: timestamp "2026-02-30T04:30:00Z" is not a valid date'],
    ['issued_at,timestamp,temp_c\n2026-01-05T04:30:00Z,2026-01-05T05:00:00Z,-75\n', 'line 2: temperature -75 °C is outside −60..60 °C'],
  ])('%j is refused', (text, message) => {
    expect(() => parseTemperatureForecastCsv(text)).toThrow(message);
  });
});

describe('calendar file', () => {
  it('reads special days by local date', () => {
    const c = parseCalendarCsv('day,kind\n2025-12-25,public-holiday\n2025-12-26,bridge-day\n');
    expect([...c]).toEqual([
      ['2025-12-25', 'public-holiday'],
      ['2025-12-26', 'bridge-day'],
    ]);
  });
  it.each([
    ['day,kind\n2025-02-29,public-holiday\n', 'line 2: day "2025-02-29" is not a calendar date YYYY-MM-DD'],
    ['day,kind\n2025-12-25,feast\n', 'line 2: kind "feast" is not one of public-holiday, bridge-day, local-event'],
    ['day,kind\n2025-12-25,public-holiday\n2025-12-25,bridge-day\n', 'line 3: duplicate day 2025-12-25'],
  ])('%j is refused', (text, message) => {
    expect(() => parseCalendarCsv(text)).toThrow(message);
  });
});
