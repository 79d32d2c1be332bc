import { gateClosureAt, isOperatingDay, operatingDaySlots } from './operating-day';

const DENVER = 'America/Denver';

describe('operating days', () => {
  it('has 24 hours HE01..HE24 on an ordinary day, from local midnight', () => {
    const slots = operatingDaySlots('2026-06-10', DENVER);
    expect(slots).toHaveLength(24);
    expect(slots[0]).toEqual({ index: 0, intervalStartUtc: '2026-06-10T06:00:00.000Z', hourEnding: 'HE01' });
    expect(slots[23]).toEqual({ index: 23, intervalStartUtc: '2026-06-11T05:00:00.000Z', hourEnding: 'HE24' });
  });

  it('has 23 hours on the spring day 2026-03-08, with no HE02', () => {
    const slots = operatingDaySlots('2026-03-08', DENVER);
    expect(slots).toHaveLength(23);
    expect(slots.map((s) => s.hourEnding).slice(0, 3)).toEqual(['HE01', 'HE03', 'HE04']);
    expect(slots.some((s) => s.hourEnding === 'HE02')).toBe(false);
    expect(slots[22].hourEnding).toBe('HE24');
    // Midnight MST is 07:00 UTC; the day ends at midnight MDT, 06:00 UTC.
    expect(slots[0].intervalStartUtc).toBe('2026-03-08T07:00:00.000Z');
    expect(slots[22].intervalStartUtc).toBe('2026-03-09T05:00:00.000Z');
  });

  it('has 25 hours on the autumn day 2026-11-01, HE01..HE25 with no label repeated', () => {
    const slots = operatingDaySlots('2026-11-01', DENVER);
    expect(slots).toHaveLength(25);
    expect(slots.map((s) => s.hourEnding)).toEqual(Array.from({ length: 25 }, (_, i) => `HE${String(i + 1).padStart(2, '0')}`));
    expect(new Set(slots.map((s) => s.intervalStartUtc)).size).toBe(25);
    expect(slots[0].intervalStartUtc).toBe('2026-11-01T06:00:00.000Z');
    expect(slots[24].intervalStartUtc).toBe('2026-11-02T06:00:00.000Z');
  });

  it('closes the gate at the local time on the day before, whatever the offset', () => {
    expect(gateClosureAt('2026-06-11', DENVER, '10:00').toISOString()).toBe('2026-06-10T16:00:00.000Z');
    // The day before the spring day is still on standard time.
    expect(gateClosureAt('2026-03-09', DENVER, '10:00').toISOString()).toBe('2026-03-08T16:00:00.000Z');
    expect(gateClosureAt('2026-03-08', DENVER, '09:30').toISOString()).toBe('2026-03-07T16:30:00.000Z');
  });

  it('accepts only real yyyy-MM-dd dates', () => {
    expect(isOperatingDay('2026-02-28')).toBe(true);
    expect(isOperatingDay('2026-02-30')).toBe(false);
    expect(isOperatingDay('2026-2-3')).toBe(false);
  });
});
