import type { Role } from '@morrowline/shared';

/** How each role is named on screen. */
export const ROLE_LABELS: Record<Role, string> = {
  viewer: 'Viewer',
  operator: 'Operator',
  supervisor: 'Supervisor',
  admin: 'Administrator',
};

/** Badge colours from our own palette; admin stands apart because it is not a desk role. */
export const ROLE_COLORS: Record<Role, string> = {
  viewer: 'slate',
  operator: 'tide',
  supervisor: 'dusk',
  admin: 'ember',
};
