import { describe, expect, it } from 'vitest';
import { hourEndingLabel, operatingDayHours, operatingDayOf } from './hour-ending';

const DENVER = 'America/Denver';

describe('operatingDayHours', () => {
  it('has 24 hours HE01..HE24 on an ordinary day, starting at local midnight', () => {
    const hours = operatingDayHours('2026-03-10', DENVER);
    expect(hours).toHaveLength(24);
    expect(hours[0]).toEqual({ hourStart: '2026-03-10T06:00:00.000Z', number: 1, label: 'HE01' });
    expect(hours[23].label).toBe('HE24');
  });

  it('has 23 hours on 8 March 2026 and no HE02 (the clock springs from 02:00 to 03:00)', () => {
    const hours = operatingDayHours('2026-03-08', DENVER);
    expect(hours).toHaveLength(23);
    expect(hours.map((h) => h.label).slice(0, 4)).toEqual(['HE01', 'HE03', 'HE04', 'HE05']);
    expect(hours.map((h) => h.label)).not.toContain('HE02');
    expect(hours[0].hourStart).toBe('2026-03-08T07:00:00.000Z'); // midnight MST
    expect(hours[1].hourStart).toBe('2026-03-08T08:00:00.000Z'); // 01:00 MST, ends 03:00 MDT
    expect(hours[22]).toEqual({ hourStart: '2026-03-09T05:00:00.000Z', number: 24, label: 'HE24' });
  });

  it('has 25 hours on 1 November 2026, HE01..HE25, each label once', () => {
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
});

describe('hourEndingLabel', () => {
  it('labels the hour by its own operating day in the zone, not in UTC', () => {
    // 05:00Z on 9 March is 23:00 MDT on 8 March: the last hour of the spring day.
    expect(hourEndingLabel('2026-03-09T05:00:00Z', DENVER)).toBe('HE24');
    expect(operatingDayOf('2026-03-09T05:00:00Z', DENVER)).toBe('2026-03-08');
    expect(hourEndingLabel('2026-03-09T06:00:00Z', DENVER)).toBe('HE01');
  });

  it('agrees with operatingDayHours on both change days', () => {
    for (const date of ['2026-03-08', '2026-11-01']) {
      for (const hour of operatingDayHours(date, DENVER)) expect(hourEndingLabel(hour.hourStart, DENVER)).toBe(hour.label);
    }
  });
});
