import { PERMISSIONS, type Role } from '@morrowline/shared';

export type SectionId =
  | 'live'
  | 'workbench'
  | 'refits'
  | 'schedules'
  | 'accuracy'
  | 'shift-log'
  | 'history'
  | 'users'
  | 'zones'
  | 'feed-keys'
  | 'audit';

export interface Section {
  id: SectionId;
  path: string;
  label: string;
  /** "desk" for forecasting work, "admin" for the administration group. */
  group: 'desk' | 'admin';
  /** The roles that may open it. The server enforces the same rule on its routes. */
  roles: readonly Role[];
}

/**
 * Every screen of the desk, in navigation order, with the permission (shared/src/roles.ts) it
 * takes to open it.
 *
 * Admin is IT, not a senior forecaster: it sees live load (to check that meter feeds arrive)
 * and the administration screens, but none of the forecasting work. The audit trail is also
 * open to supervisors, who answer for what was published.
 */
export const SECTIONS: readonly Section[] = [
  { id: 'live', path: '/live', label: 'Live load', group: 'desk', roles: PERMISSIONS.signedIn },
  { id: 'workbench', path: '/workbench', label: 'Model workbench', group: 'desk', roles: PERMISSIONS.forecast },
  { id: 'refits', path: '/refits', label: 'Refits', group: 'desk', roles: PERMISSIONS.forecast },
  { id: 'schedules', path: '/schedules', label: 'Day-ahead schedule', group: 'desk', roles: PERMISSIONS.readForecasts },
  { id: 'accuracy', path: '/accuracy', label: 'Accuracy', group: 'desk', roles: PERMISSIONS.readForecasts },
  { id: 'shift-log', path: '/shift-log', label: 'Shift log', group: 'desk', roles: PERMISSIONS.forecast },
  { id: 'history', path: '/history', label: 'History', group: 'desk', roles: PERMISSIONS.readForecasts },
  { id: 'users', path: '/admin/users', label: 'Users', group: 'admin', roles: PERMISSIONS.administer },
  { id: 'zones', path: '/admin/zones', label: 'Zones', group: 'admin', roles: PERMISSIONS.administer },
  { id: 'feed-keys', path: '/admin/feed-keys', label: 'Feed keys', group: 'admin', roles: PERMISSIONS.administer },
  { id: 'audit', path: '/admin/audit', label: 'Audit trail', group: 'admin', roles: PERMISSIONS.readAudit },
];

/**
 * The wall display of live load: open to everyone signed in (like Live load), linked from the
 * navigation but not a section of the desk (it has no shell to navigate in).
 */
export const WALL_PATH = '/wall';

export function sectionById(id: SectionId): Section {
  const section = SECTIONS.find((candidate) => candidate.id === id);
  if (!section) throw new Error(`Unknown section ${id}`);
  return section;
}

export function canOpen(role: Role, section: Section): boolean {
  return section.roles.includes(role);
}

export function sectionsFor(role: Role): Section[] {
  return SECTIONS.filter((section) => canOpen(role, section));
}

/** Where a role lands after sign-in when it did not ask for a particular page. */
export function homePathFor(role: Role): string {
  return sectionsFor(role)[0]?.path ?? '/live';
}
