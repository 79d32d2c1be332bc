import { DESK_EVENTS, PERMISSIONS, type DeskScheduleEvent, type Role } from '@morrowline/shared';

type DeskEvent = (typeof DESK_EVENTS)[keyof typeof DESK_EVENTS];

/**
 * Which roles hear each desk message, as the HTTP routes that read the same things allow
 * (README's role table): live load, forecasts and alerts for every desk; refit progress (model
 * internals) for the forecasting roles; a schedule's drafts and submissions for the forecasting
 * roles, its publication for everyone who reads published schedules. The role × route test
 * checks every DESK_EVENTS name against this table.
 */
export const DESK_AUDIENCE: Record<DeskEvent, (payload: unknown) => readonly Role[]> = {
  [DESK_EVENTS.hello]: () => PERMISSIONS.signedIn,
  [DESK_EVENTS.readings]: () => PERMISSIONS.signedIn,
  [DESK_EVENTS.alertRaised]: () => PERMISSIONS.signedIn,
  [DESK_EVENTS.alertAcknowledged]: () => PERMISSIONS.signedIn,
  [DESK_EVENTS.forecast]: () => PERMISSIONS.signedIn,
  [DESK_EVENTS.refitProgress]: () => PERMISSIONS.readDeskWork,
  [DESK_EVENTS.schedule]: (payload) => (isPublication(payload as DeskScheduleEvent) ? PERMISSIONS.readForecasts : PERMISSIONS.readDeskWork),
};

/** A change viewers may hear of: a revision published (or superseded by one). */
function isPublication(event: DeskScheduleEvent): boolean {
  return event.state === 'published' || event.state === 'superseded';
}

export function roleRoom(role: Role): string {
  return `role:${role}`;
}

export function userRoom(userId: number): string {
  return `user:${userId}`;
}
