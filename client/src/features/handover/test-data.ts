import type { CurrentShiftDto, HandoverDraftDto, HandoverNoteDto, ShiftDto, ZoneDto } from '@morrowline/shared';

/** Test data from the Tallowmere Valley demo, for the shift log's tests. */
export const lateShift: ShiftDto = {
  label: 'Late Tue 3 Mar 14:00–22:00',
  start: '2026-03-03T21:00:00.000Z',
  end: '2026-03-04T05:00:00.000Z',
  timeZone: 'America/Denver',
};

export const currentShift: CurrentShiftDto = {
  current: lateShift,
  previous: { ...lateShift, label: 'Early Tue 3 Mar 06:00–14:00', start: '2026-03-03T13:00:00.000Z', end: lateShift.start },
  onShift: [{ id: 2, name: 'Ines Marlow', role: 'operator' }],
};

export const quarryZone: ZoneDto = {
  id: 4,
  code: 'QUARRY',
  name: 'Quarry Hill',
  timeZone: 'America/Denver',
  alertThresholdPct: 5,
  alertConsecutiveHours: 2,
  gateClosure: '10:00',
  minPlausibleMw: 0,
  maxPlausibleMw: 400,
  active: true,
};

export function draftWith(openItems: HandoverDraftDto['openItems']): HandoverDraftDto {
  return {
    shift: lateShift,
    events: [
      {
        at: '2026-03-03T22:15:00.000Z',
        action: 'outage.create',
        actorEmail: 'ines.marlow@tallowmere.example',
        subjectType: 'zone',
        subjectId: 'QUARRY',
        reason: 'Feeder Q-7 tripped',
        summary: 'Outage window marked · zone QUARRY',
      },
    ],
    openItems,
  };
}

export function noteFixture(overrides: Partial<HandoverNoteDto> = {}): HandoverNoteDto {
  return {
    id: 31,
    shift: { ...lateShift, label: 'Early Tue 3 Mar 06:00–14:00' },
    author: { id: 2, name: 'Ines Marlow' },
    body: 'Quiet morning.',
    items: [],
    createdAt: '2026-03-03T20:55:00.000Z',
    acknowledgedBy: null,
    acknowledgedAt: null,
    reply: null,
    ...overrides,
  };
}
