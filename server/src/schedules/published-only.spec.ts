import { ForbiddenException } from '@nestjs/common';
import type { DayScheduleDto, ScheduleRevisionDto, ScheduleState, ZoneScheduleDto } from '@morrowline/shared';
import { dayFor, revisionFor, revisionsFor } from './published-only';

const revision = (n: number, state: ScheduleState) => ({ id: n, revision: n, zone: 'MILLRACE', operatingDay: '2030-06-12', state }) as ScheduleRevisionDto;
const day = {
  operatingDay: '2030-06-12',
  zones: [{ zone: 'MILLRACE', working: revision(2, 'draft'), published: revision(1, 'published') } as unknown as ZoneScheduleDto],
} as DayScheduleDto;

describe('viewers see published schedules only', () => {
  it('leaves the draft out of the day view for a viewer, not for an operator', () => {
    expect(dayFor('viewer', day).zones[0]).toMatchObject({ working: null, published: { revision: 1 } });
    expect(dayFor('operator', day).zones[0].working?.revision).toBe(2);
  });

  it('lists only published and superseded revisions to a viewer', () => {
    const all = [revision(3, 'submitted'), revision(2, 'published'), revision(1, 'superseded')];
    expect(revisionsFor('viewer', all).map((r) => r.revision)).toEqual([2, 1]);
    expect(revisionsFor('supervisor', all)).toHaveLength(3);
  });

  it('refuses a viewer a draft revision by id', () => {
    expect(() => revisionFor('viewer', revision(2, 'returned'))).toThrow(ForbiddenException);
    expect(revisionFor('viewer', revision(1, 'superseded')).revision).toBe(1);
    expect(revisionFor('operator', revision(2, 'draft')).revision).toBe(2);
  });
});
