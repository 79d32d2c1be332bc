/** The four desk roles, lowest to highest privilege for forecasting work (admin is separate: IT). */
export const ROLES = ['viewer', 'operator', 'supervisor', 'admin'] as const;
export type Role = (typeof ROLES)[number];

/**
 * What each role may do. Admin administers users, zones and feeds; it takes no forecasting
 * decisions, so it is not a "super-supervisor".
 */
export const FORECASTING_ROLES: readonly Role[] = ['operator', 'supervisor'];

export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (ROLES as readonly string[]).includes(value);
}
