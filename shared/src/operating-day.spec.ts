import {
  dayCount,
  gateClosureAt,
  hourEndingLabel,
  isOperatingDay,
  operatingDay,
  operatingDayHours,
  operatingDayOf,
  operatingDays,
  operatingDaySlots,
  operatingDayStart,
  operatingDayStarts,
} from './operating-day';

/**
 * The demo zones' time zone. Its daylight-saving days come from the IANA time zone database
 * (tzdata, file `northamerica`): `Zone America/Denver -7:00 US M%sT` with the US rules from 2007,
 * `Rule US 2007 max - Mar Sun>=8 2:00 1:00 D` and `Rule US 2007 max - Nov Sun>=1 2:00 0 S`. So
 * the clocks spring from 02:00 MST (UTC−7) to 03:00 MDT (UTC−6) on the second Sunday of March
 * (8 March 2026, 14 March 2027) and fall back from 02:00 MDT to 01:00 MST on the first Sunday of
 * November (1 November 2026, 7 November 2027).
 */
const DENVER = 'America/Denver';
const HE = (n: number) => `HE${String(n).padStart(2, '0')}`;

describe('operating days', () => {
  it('has 24 hours HE01..HE24 on an ordinary day, from local midnight', () => {
    const slots = operatingDaySlots('2026-06-10', DENVER);
    expect(slots).toHaveLength(24);
    expect(slots[0]).toEqual({ index: 0, intervalStartUtc: '2026-06-10T06:00:00.000Z', hourEnding: 'HE01' });
    expect(slots[23]).toEqual({ index: 23, intervalStartUtc: '2026-06-11T05:00:00.000Z', hourEnding: 'HE24' });

    const hours = operatingDayHours('2026-03-10', DENVER);
    expect(hours).toHaveLength(24);
    expect(hours[0]).toEqual({ hourStart: '2026-03-10T06:00:00.000Z', number: 1, label: 'HE01' });
    expect(hours[23].label).toBe('HE24');
  });

  it('has 23 hours on the spring day 2026-03-08, with no HE02 (the clock springs from 02:00 to 03:00)', () => {
    const slots = operatingDaySlots('2026-03-08', DENVER);
    expect(slots).toHaveLength(23);
    expect(slots.map((s) => s.hourEnding).slice(0, 3)).toEqual(['HE01', 'HE03', 'HE04']);
    expect(slots.some((s) => s.hourEnding === 'HE02')).toBe(false);
    expect(slots[22].hourEnding).toBe('HE24');
    // Midnight MST is 07:00 UTC; the day ends at midnight MDT, 06:00 UTC.
    expect(slots[0].intervalStartUtc).toBe('2026-03-08T07:00:00.000Z');
    expect(slots[22].intervalStartUtc).toBe('2026-03-09T05:00:00.000Z');

    const hours = operatingDayHours('2026-03-08', DENVER);
    expect(hours).toHaveLength(23);
    expect(hours.map((h) => h.label).slice(0, 4)).toEqual(['HE01', 'HE03', 'HE04', 'HE05']);
    expect(hours.map((h) => h.label)).not.toContain('HE02');
    expect(hours[0].hourStart).toBe('2026-03-08T07:00:00.000Z'); // midnight MST
    expect(hours[1].hourStart).toBe('2026-03-08T08:00:00.000Z'); // 01:00 MST, ends 03:00 MDT
    expect(hours[22]).toEqual({ hourStart: '2026-03-09T05:00:00.000Z', number: 24, label: 'HE24' });
  });

  it('has 25 hours on the autumn day 2026-11-01, HE01..HE25 with no label repeated', () => {
    const slots = operatingDaySlots('2026-11-01', DENVER);
    expect(slots).toHaveLength(25);
    expect(slots.map((s) => s.hourEnding)).toEqual(Array.from({ length: 25 }, (_, i) => HE(i + 1)));
    expect(new Set(slots.map((s) => s.intervalStartUtc)).size).toBe(25);
    expect(slots[0].intervalStartUtc).toBe('2026-11-01T06:00:00.000Z');
    expect(slots[24].intervalStartUtc).toBe('2026-11-02T06:00:00.000Z');

    const hours = operatingDayHours('2026-11-01', DENVER);
    expect(hours).toHaveLength(25);
    expect(hours[0].hourStart).toBe('2026-11-01T06:00:00.000Z'); // midnight MDT
    const labels = hours.map((h) => h.label);
    expect(new Set(labels).size).toBe(25);
    expect(labels[0]).toBe('HE01');
    expect(labels[1]).toBe('HE02'); // 01:00 MDT to 01:00 MST
    expect(labels[2]).toBe('HE03'); // 01:00 MST to 02:00 MST
    expect(labels[24]).toBe('HE25');
    expect(hours[24].hourStart).toBe('2026-11-02T06:00:00.000Z');
  });

  it('follows the same rule in another year (14 March and 7 November 2027)', () => {
    expect(operatingDayHours('2027-03-14', DENVER).map((h) => h.label).slice(0, 3)).toEqual(['HE01', 'HE03', 'HE04']);
    expect(operatingDayHours('2027-03-14', DENVER)).toHaveLength(23);
    expect(operatingDayHours('2027-03-07', DENVER)).toHaveLength(24);
    expect(operatingDayHours('2027-11-07', DENVER).at(-1)?.label).toBe('HE25');
    expect(operatingDayHours('2027-10-31', DENVER)).toHaveLength(24);
  });

  it('gives 23, 24 and 25 hours with hour-ending labels, day by day over a range', () => {
    const spring = operatingDay('2026-03-08', DENVER);
    expect(spring.labels).toHaveLength(23);
    expect(spring.labels.slice(0, 3)).toEqual(['HE01', 'HE03', 'HE04']);
    const autumn = operatingDay('2026-11-01', DENVER);
    expect(autumn.labels).toHaveLength(25);
    expect(autumn.labels.at(-1)).toBe('HE25');
    expect(operatingDays('2026-10-31', '2026-11-02', DENVER).map((d) => d.labels.length)).toEqual([24, 25, 24]);
    expect(autumn.end - autumn.start).toBe(25 * 3_600_000);
  });

  it('starts the day at local midnight and counts calendar days', () => {
    expect(new Date(operatingDayStart('2026-03-09', DENVER)).toISOString()).toBe('2026-03-09T06:00:00.000Z'); // midnight MDT
    expect(new Date(operatingDayStart('2026-11-02', DENVER)).toISOString()).toBe('2026-11-02T07:00:00.000Z'); // midnight MST
    expect(dayCount('2026-10-31', '2026-11-02')).toBe(3);
    expect(dayCount('2026-03-01', '2026-03-31')).toBe(31);
  });

  it('accepts only real yyyy-MM-dd dates', () => {
    expect(isOperatingDay('2026-02-28')).toBe(true);
    expect(isOperatingDay('2026-02-30')).toBe(false);
    expect(isOperatingDay('2026-2-3')).toBe(false);
    expect(isOperatingDay('0000-01-01')).toBe(false);
    expect(isOperatingDay('9999-12-31')).toBe(false);
    expect(isOperatingDay('2100-12-31')).toBe(true);
    expect(() => operatingDay('2026-02-30', DENVER)).toThrow('"2026-02-30" is not a date (yyyy-MM-dd)');
    expect(operatingDays('2026-02-30', '2026-03-02', DENVER)).toEqual([]);
  });
});

describe('hour-ending labels of single hours', () => {
  it('labels the hour by its own operating day in the zone, not in UTC', () => {
    // 05:00Z on 9 March is 23:00 MDT on 8 March: the last hour of the spring day.
    expect(hourEndingLabel('2026-03-09T05:00:00Z', DENVER)).toBe('HE24');
    expect(operatingDayOf('2026-03-09T05:00:00Z', DENVER)).toBe('2026-03-08');
    expect(hourEndingLabel('2026-03-09T06:00:00Z', DENVER)).toBe('HE01');
  });

  it('agrees with the operating day on both change days, whether the hour is given as text, ms or Date', () => {
    for (const date of ['2026-03-08', '2026-11-01']) {
      for (const hour of operatingDayHours(date, DENVER)) {
        expect(hourEndingLabel(hour.hourStart, DENVER)).toBe(hour.label);
        expect(hourEndingLabel(Date.parse(hour.hourStart), DENVER)).toBe(hour.label);
        expect(hourEndingLabel(new Date(hour.hourStart), DENVER)).toBe(hour.label);
      }
    }
  });
});

describe('operating-day starts in an hourly series', () => {
  it('gives a 23-hour day in spring and a 25-hour day in autumn', () => {
    // 2026-03-06T07:00Z is local midnight (MST, UTC−7); DST starts 2026-03-08
    const spring = operatingDayStarts(Date.parse('2026-03-06T07:00:00Z'), 24 * 4, DENVER);
    expect(spring.dates.slice(0, 4)).toEqual(['2026-03-06', '2026-03-07', '2026-03-08', '2026-03-09']);
    expect(spring.starts.slice(1, 4).map((s, i) => s - spring.starts[i])).toEqual([24, 24, 23]);
    const autumn = operatingDayStarts(Date.parse('2026-10-31T06:00:00Z'), 24 * 3, DENVER);
    expect(autumn.starts.slice(1).map((s, i) => s - autumn.starts[i])).toEqual([24, 25]);
  });

  it('starts at the first local midnight inside the series', () => {
    const r = operatingDayStarts(Date.parse('2026-01-10T15:00:00Z'), 48, DENVER);
    expect(r.starts[0]).toBe(16); // 2026-01-11T07:00Z, 16 hours after 15:00Z
    expect(r.dates[0]).toBe('2026-01-11');
  });
});

describe('gate closure', () => {
  const at = (date: string, gate: string) => new Date(gateClosureAt(date, DENVER, gate)).toISOString();

  it('closes the gate at the local time on the day before, whatever the offset', () => {
    expect(at('2026-06-11', '10:00')).toBe('2026-06-10T16:00:00.000Z');
    expect(at('2026-06-10', '10:00')).toBe('2026-06-09T16:00:00.000Z');
    // The day before the spring day is still on standard time.
    expect(at('2026-03-09', '10:00')).toBe('2026-03-08T16:00:00.000Z');
    expect(at('2026-03-08', '09:30')).toBe('2026-03-07T16:30:00.000Z');
    // The autumn day is on standard time from 02:00, so its 10:00 is 17:00 UTC.
    expect(at('2026-11-02', '10:00')).toBe('2026-11-01T17:00:00.000Z');
    expect(at('2026-11-01', '10:00')).toBe('2026-10-31T16:00:00.000Z');
  });

  it('refuses a day that is not a date', () => {
    expect(() => gateClosureAt('2026-02-30', DENVER, '10:00')).toThrow('is not a date');
  });
});
