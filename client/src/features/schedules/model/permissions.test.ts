import type { Role } from '@morrowline/shared';
import { describe, expect, it } from 'vitest';
import { revisionFixture, zoneFixture } from '../test-data';
import { mayDownload, scheduleActions } from './permissions';

const DAY = '2026-05-13';
const ines = { id: 2, role: 'operator' as Role };
const hal = { id: 4, role: 'supervisor' as Role };
const nora = { id: 5, role: 'supervisor' as Role };
const pia = { id: 1, role: 'viewer' as Role };
const dana = { id: 6, role: 'admin' as Role };

const offered = (actions: ReturnType<typeof scheduleActions>) =>
  (['startDraft', 'adjust', 'submit', 'approve', 'returnToOperator', 'correct'] as const).filter((key) => actions[key]);

describe('schedule action visibility', () => {
  it('before any draft: forecasters may start one, viewers and admin nothing', () => {
    const zone = zoneFixture('MILLRACE', DAY);
    expect(offered(scheduleActions(ines, zone))).toEqual(['startDraft']);
    expect(offered(scheduleActions(hal, zone))).toEqual(['startDraft']);
    expect(offered(scheduleActions(pia, zone))).toEqual([]);
    expect(offered(scheduleActions(dana, zone))).toEqual([]);
  });

  it('a draft before gate closure: operator adjusts and submits; a viewer only reads', () => {
    const zone = zoneFixture('MILLRACE', DAY, { working: revisionFixture('MILLRACE', DAY, 'draft') });
    expect(offered(scheduleActions(ines, zone))).toEqual(['adjust', 'submit']);
    expect(scheduleActions(ines, zone).submitIsLate).toBe(false);
    expect(offered(scheduleActions(pia, zone))).toEqual([]);
  });

  it('after gate closure an operator may still adjust but not submit, and is told why; a supervisor submits late', () => {
    const zone = zoneFixture('MILLRACE', DAY, { gateClosed: true, working: revisionFixture('MILLRACE', DAY, 'returned') });
    const operator = scheduleActions(ines, zone);
    expect(offered(operator)).toEqual(['adjust']);
    expect(operator.submitRefusal).toMatch(/only a supervisor/);
    const supervisor = scheduleActions(hal, zone);
    expect(offered(supervisor)).toEqual(['adjust', 'submit']);
    expect(supervisor.submitIsLate).toBe(true);
  });

  it('submitted: another supervisor approves or returns; the submitter, operators and viewers do not', () => {
    const zone = zoneFixture('MILLRACE', DAY, { working: revisionFixture('MILLRACE', DAY, 'submitted', { submittedBy: { id: 4, name: 'Hal Brennick' } }) });
    expect(offered(scheduleActions(nora, zone))).toEqual(['approve', 'returnToOperator']);
    const own = scheduleActions(hal, zone);
    expect(offered(own)).toEqual([]);
    expect(own.approveRefusal).toMatch(/another supervisor/);
    expect(offered(scheduleActions(ines, zone))).toEqual([]);
    expect(offered(scheduleActions(pia, zone))).toEqual([]);
  });

  it('published: read-only, a correction for forecasters, downloads for everyone', () => {
    const published = revisionFixture('MILLRACE', DAY, 'published');
    const zone = zoneFixture('MILLRACE', DAY, { published });
    expect(offered(scheduleActions(ines, zone))).toEqual(['correct']);
    expect(offered(scheduleActions(pia, zone))).toEqual([]);
    expect(mayDownload(published)).toBe(true);
    expect(mayDownload(revisionFixture('MILLRACE', DAY, 'superseded'))).toBe(true);
    expect(mayDownload(revisionFixture('MILLRACE', DAY, 'submitted'))).toBe(false);
  });

  it('only supervisors keep the subscribers', () => {
    const zone = zoneFixture('MILLRACE', DAY);
    expect(scheduleActions(hal, zone).manageSubscribers).toBe(true);
    expect(scheduleActions(ines, zone).manageSubscribers).toBe(false);
  });
});
