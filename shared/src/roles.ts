/** The four desk roles, lowest to highest privilege for forecasting work (admin is separate: IT). */
export const ROLES = ['viewer', 'operator', 'supervisor', 'admin'] as const;
export type Role = (typeof ROLES)[number];

/**
 * Who may do what: each permission and the roles that hold it. The server's route guards
 * (@Roles) and socket checks, the desk's navigation and its buttons all read this one table;
 * the server has the last word.
 *
 * Admin is IT, not a "super-supervisor": it administers users, zones and meter feeds and watches
 * live load (to check that the feeds arrive), but takes no forecasting decisions.
 */
export const PERMISSIONS = {
  /** Anyone signed in: live load and the desk's live updates. */
  signedIn: ROLES,
  /** Read what the desk puts out: published schedules (and their exports), accuracy, reading history. */
  readForecasts: ['viewer', 'operator', 'supervisor'],
  /**
   * Read the work in progress behind it: schedule drafts and submissions, handover notes, model
   * versions, refits and the workbench's analyses. Viewers see published schedules only.
   */
  readDeskWork: ['operator', 'supervisor'],
  /**
   * Do the forecasting work: analyses, refits and promotions, schedule drafts, adjustments and
   * submissions, alert acknowledgements, outage windows, shift notes, reading uploads.
   */
  forecast: ['operator', 'supervisor'],
  /** Approve or return a submitted schedule, submit after gate closure, manage the schedule's subscribers. */
  supervise: ['supervisor'],
  /** Read the audit trail: supervisors answer for what was published, admins for accounts and feeds. */
  readAudit: ['supervisor', 'admin'],
  /** Maintain the holiday and special-day calendar: supervisors answer for the desk's days, admins keep the reference data. */
  editCalendar: ['supervisor', 'admin'],
  /** Users, zones, meter feeds and weather stations (and which stations make each zone's temperature). */
  administer: ['admin'],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;

/** Whether a role holds a permission. */
export function may(role: Role, permission: Permission): boolean {
  return (PERMISSIONS[permission] as readonly Role[]).includes(role);
}

export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (ROLES as readonly string[]).includes(value);
}
