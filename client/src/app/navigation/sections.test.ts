import type { Role } from '@morrowline/shared';
import { describe, expect, it } from 'vitest';
import { canOpen, homePathFor, sectionById, sectionsFor } from './sections';

const labelsFor = (role: Role) => sectionsFor(role).map((section) => section.label);

describe('role navigation', () => {
  it('shows a viewer what it may watch, and no forecasting work or admin', () => {
    expect(labelsFor('viewer')).toEqual(['Live load', 'Day-ahead schedule', 'Accuracy', 'History']);
  });

  it('adds the forecasting work for an operator, still no admin', () => {
    expect(labelsFor('operator')).toEqual([
      'Live load',
      'Model workbench',
      'Refits',
      'Day-ahead schedule',
      'Accuracy',
      'Shift log',
      'History',
    ]);
  });

  it('gives a supervisor the audit trail but not users or zones', () => {
    const labels = labelsFor('supervisor');
    expect(labels).toContain('Audit trail');
    expect(labels).toContain('Shift log');
    expect(labels).not.toContain('Users');
    expect(labels).not.toContain('Zones');
  });

  it('gives admin the administration and live load, but no forecasting decisions', () => {
    expect(labelsFor('admin')).toEqual(['Live load', 'Users', 'Zones', 'Feed keys', 'Audit trail']);
    expect(canOpen('admin', sectionById('schedules'))).toBe(false);
    expect(canOpen('admin', sectionById('refits'))).toBe(false);
  });

  it('refuses the feed-key screen to every role but admin', () => {
    const feedKeys = sectionById('feed-keys');
    expect((['viewer', 'operator', 'supervisor'] as const).some((role) => canOpen(role, feedKeys))).toBe(false);
    expect(canOpen('admin', feedKeys)).toBe(true);
  });

  it('refuses the users screen to every role but admin', () => {
    const users = sectionById('users');
    expect((['viewer', 'operator', 'supervisor'] as const).some((role) => canOpen(role, users))).toBe(false);
    expect(canOpen('admin', users)).toBe(true);
  });

  it('lands every role on its first section', () => {
    expect(homePathFor('viewer')).toBe('/live');
    expect(homePathFor('admin')).toBe('/live');
  });
});
