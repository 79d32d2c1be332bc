import { shiftAt } from './shifts';

const pattern = { starts: ['06:00', '14:00', '22:00'], timeZone: 'America/Denver' };

describe('shifts', () => {
  it('finds the shift that contains a moment (MST is UTC-7 in January)', () => {
    const shift = shiftAt(pattern, new Date('2026-01-15T16:30:00Z')); // 09:30 local
    expect(shift.start).toBe('2026-01-15T13:00:00.000Z');
    expect(shift.end).toBe('2026-01-15T21:00:00.000Z');
    expect(shift.label).toMatch(/^Early Thu 15 Jan 06:00–14:00$/);
  });

  it('puts the small hours in the night shift that began the evening before', () => {
    const shift = shiftAt(pattern, new Date('2026-01-15T09:00:00Z')); // 02:00 local
    expect(shift.start).toBe('2026-01-15T05:00:00.000Z'); // 22:00 local on the 14th
    expect(shift.label.startsWith('Night Wed 14 Jan 22:00')).toBe(true);
  });

  it('gives the previous shift with offset -1', () => {
    const previous = shiftAt(pattern, new Date('2026-01-15T16:30:00Z'), -1);
    expect(previous.end).toBe('2026-01-15T13:00:00.000Z');
    expect(previous.start).toBe('2026-01-15T05:00:00.000Z');
  });

  it('makes the night shift over the spring change one hour shorter (US DST starts 8 March 2026)', () => {
    const night = shiftAt(pattern, new Date('2026-03-08T10:00:00Z'));
    const hours = (Date.parse(night.end) - Date.parse(night.start)) / 3_600_000;
    expect(hours).toBe(7);
  });

  it('makes the night shift over the autumn change one hour longer (US DST ends 1 November 2026)', () => {
    const night = shiftAt(pattern, new Date('2026-11-01T10:00:00Z'));
    expect((Date.parse(night.end) - Date.parse(night.start)) / 3_600_000).toBe(9);
  });
});
