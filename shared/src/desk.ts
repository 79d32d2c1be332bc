import type { Role } from './roles';

/**
 * The desks' live channel (socket.io). A desk connects to DESK_NAMESPACE with
 * `auth: { token: <access token> }`; a missing, expired or invalid token is refused.
 */
export const DESK_NAMESPACE = '/desk';

export const DESK_EVENTS = {
  hello: 'desk:hello',
  /** Readings just stored, one event per stored batch (DeskReadings). */
  readings: 'desk:readings',
  /** A deviation alert raised or extended (AlertDto). */
  alertRaised: 'desk:alert-raised',
  /** A deviation alert acknowledged (AlertDto). */
  alertAcknowledged: 'desk:alert-acknowledged',
  /** A new forecast run for a zone (ForecastRunDto). */
  forecast: 'desk:forecast',
  /** Progress of a refit job (RefitJobDto). */
  refitProgress: 'desk:refit-progress',
  /** A day-ahead schedule revision changed: drafted, adjusted, submitted, returned, published (DeskScheduleEvent). */
  schedule: 'desk:schedule',
} as const;

/** Stored readings, compact: per zone, parallel arrays of UTC hour starts and MW. */
export interface DeskReadings {
  zones: { zone: string; hours: string[]; mw: number[] }[];
  receivedAt: string;
}

export interface DeskHello {
  user: { id: number; name: string; role: Role };
  serverTime: string;
}
