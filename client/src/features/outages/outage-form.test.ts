import { describe, expect, it } from 'vitest';
import { formValuesOf, localToIso, toCreateRequest, validateOutageForm, type OutageFormValues } from './outage-form';
import { outageHoursOf } from './outage-hours';

const TZ = 'America/Denver';
const base: OutageFormValues = { kind: 'outage', start: '2026-07-14T09:00', end: '2026-07-14T13:00', stillOpen: false, note: 'Quarry Hill feeder 4 tripped', reason: '' };

describe('outage window form', () => {
  it('sends the zone’s wall-clock time as ISO with the zone’s offset, summer and winter', () => {
    expect(localToIso('2026-07-14T09:00', TZ).iso).toBe('2026-07-14T09:00:00-06:00');
    expect(localToIso('2026-01-14T09:00', TZ).iso).toBe('2026-01-14T09:00:00-07:00');
    expect(toCreateRequest('QUARRY', base, TZ)).toEqual({ zone: 'QUARRY', kind: 'outage', start: '2026-07-14T09:00:00-06:00', end: '2026-07-14T13:00:00-06:00', note: 'Quarry Hill feeder 4 tripped' });
    expect(toCreateRequest('QUARRY', { ...base, stillOpen: true, end: '' }, TZ).end).toBeNull();
  });

  it('refuses a time the clocks skip and takes the first of a time they pass twice', () => {
    const skipped = localToIso('2026-03-08T02:30', TZ);
    expect(skipped.iso).toBeNull();
    expect(skipped.error).toMatch(/does not happen/);
    const twice = localToIso('2026-11-01T01:30', TZ);
    expect(twice).toMatchObject({ iso: '2026-11-01T01:30:00-06:00', ambiguous: true });
    expect(localToIso('2026-11-01T03:00', TZ)).toMatchObject({ iso: '2026-11-01T03:00:00-07:00', ambiguous: false });
  });

  it('wants the end after the start, counting the hour the clocks fall back', () => {
    expect(validateOutageForm(base, TZ, false)).toEqual({});
    expect(validateOutageForm({ ...base, end: '2026-07-14T09:00' }, TZ, false).end).toMatch(/after the start/);
    expect(validateOutageForm({ ...base, end: '2026-07-14T08:00' }, TZ, false).end).toMatch(/after the start/);
    // On the fall-back night both times are read as their first occurrence, so 01:10 is before 01:30.
    expect(validateOutageForm({ ...base, start: '2026-11-01T01:30', end: '2026-11-01T01:10' }, TZ, false).end).toMatch(/after the start/);
    // Across the change: 00:30 to 01:30 is one hour apart on the clock and one real hour.
    expect(validateOutageForm({ ...base, start: '2026-11-01T00:30', end: '2026-11-01T01:30' }, TZ, false)).toEqual({});
    expect(validateOutageForm({ ...base, stillOpen: true, end: '' }, TZ, false)).toEqual({});
    expect(validateOutageForm({ ...base, end: '' }, TZ, false).end).toMatch(/still open/);
  });

  it('wants a note, and a reason when editing', () => {
    expect(validateOutageForm({ ...base, note: '  ' }, TZ, false).note).toBeTruthy();
    expect(validateOutageForm(base, TZ, true).reason).toBeTruthy();
    expect(validateOutageForm({ ...base, reason: 'restored later than logged' }, TZ, true)).toEqual({});
  });

  it('reads a stored window back as the zone’s wall clock', () => {
    const values = formValuesOf({ id: 1, zone: 'QUARRY', kind: 'bad-data', start: '2026-11-01T07:00:00.000Z', end: null, note: 'n', createdBy: null, createdAt: '', updatedAt: '', closedAt: null, closedBy: null }, TZ);
    expect(values).toMatchObject({ kind: 'bad-data', start: '2026-11-01T01:00', end: '', stillOpen: true });
  });

  it('flags the hours inside windows for the chart, an open one to the end', () => {
    const hours = ['2026-07-14T14:00:00.000Z', '2026-07-14T15:00:00.000Z', '2026-07-14T16:00:00.000Z', '2026-07-14T17:00:00.000Z'];
    const win = { id: 1, zone: 'QUARRY', kind: 'outage' as const, note: '', createdBy: null, createdAt: '', updatedAt: '', closedAt: null, closedBy: null };
    expect(outageHoursOf(hours, [{ ...win, start: hours[1], end: hours[2] }])).toEqual([false, true, false, false]);
    expect(outageHoursOf(hours, [{ ...win, start: hours[2], end: null }])).toEqual([false, false, true, true]);
  });
});
