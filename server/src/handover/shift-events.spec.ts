import type { AuditEntryDto } from '@morrowline/shared';
import { toShiftEvent } from './shift-events';

const entry = (overrides: Partial<AuditEntryDto>): AuditEntryDto => ({
  id: 1, at: '2026-12-02T15:00:00.000Z', actorId: null, actorEmail: null, action: 'alert.raise',
  subjectType: 'alert', subjectId: '3', before: null, after: null, reason: null, ...overrides,
});
const names = new Map([['LANTERNSIDE', 'Lanternside'], ['MILLRACE', 'Millrace']]);

describe('shift-log events', () => {
  it('names the zone and how far the load was off for a deviation alert, not "alert 3"', () => {
    const event = toShiftEvent(entry({ after: { id: 3, zone: 'LANTERNSIDE', peakDeviationMw: 12.3, peakDeviationPct: 9.8 } }), names);
    expect(event.summary).toBe('Deviation alert raised · Lanternside +12.3 MW');
  });

  it('falls back to the signed percent when the alert carries no MW', () => {
    const event = toShiftEvent(entry({ action: 'alert.acknowledge', after: { zone: 'MILLRACE', peakDeviationPct: -7.25 } }), names);
    expect(event.summary).toBe('Deviation alert acknowledged · Millrace −7.3 %');
  });

  it('names a schedule by zone, day and revision', () => {
    const event = toShiftEvent(entry({ action: 'schedule.publish', subjectType: 'schedule', subjectId: '12', after: { zone: 'MILLRACE', operatingDay: '2026-12-03', revision: 2 } }), names);
    expect(event.summary).toBe('Schedule published · Millrace 2026-12-03 revision 2');
  });

  it('keeps the code of a zone it does not know, and the subject where no zone is named', () => {
    expect(toShiftEvent(entry({ action: 'outage.create', subjectType: 'outage', after: { zone: 'GONE' } }), names).summary).toBe('Outage window marked · GONE');
    expect(toShiftEvent(entry({ action: 'model.promote', subjectType: 'model', subjectId: '12', after: { inService: 12 } }), names).summary).toBe('Model promoted into service · model 12');
  });
});
