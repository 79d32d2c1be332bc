import type { AlertDto, DeskScheduleEvent, ForecastRunDto, RefitJobDto } from '@morrowline/shared';

/**
 * The server's domain events: what happened, told to whoever listens (`@OnEvent(name)`), always
 * after the change is committed. Every payload is a plain, JSON-serialisable object (strings,
 * numbers, arrays, no entities, no Dates, no class instances), so the same events can later
 * travel between machines. This file imports nothing of the features: they all depend on it.
 */
export const DOMAIN_EVENTS = {
  /** Readings stored in one batch whose stored value is new or changed (ReadingsStored). */
  readingsStored: 'readings.stored',
  /** A refit job was queued, moved on, finished or failed (RefitJobDto). */
  refitProgress: 'refit.progress',
  /** A forecast run was stored for a zone (ForecastRunDto). */
  forecastIssued: 'forecast.issued',
  /** A day-ahead schedule revision changed state or was adjusted (DeskScheduleEvent). */
  scheduleChanged: 'schedule.changed',
  /** A deviation alert was raised or widened (AlertDto). */
  alertRaised: 'alert.raised',
  /** A deviation alert was acknowledged (AlertDto). */
  alertAcknowledged: 'alert.acknowledged',
  /** A user's sessions ended or their grounds changed: signed out, deactivated, role changed (SessionEnded). */
  sessionEnded: 'session.ended',
  /** A zone was created or its settings changed: switched on or off, plausible range (ZoneChanged). */
  zoneChanged: 'zone.changed',
} as const;

/** Whose open desk sockets must close, and why (they may reconnect if their token still holds). */
export interface SessionEnded {
  userId: number;
  reason: 'signed-out' | 'deactivated' | 'role-changed';
}

/** A zone created or changed, as stored. */
export interface ZoneChanged {
  zoneId: number;
  code: string;
  active: boolean;
}

/** Readings of one stored batch, per zone: parallel arrays of UTC hour starts (ISO 8601) and MW. */
export interface ReadingsStored {
  zones: { zoneId: number; zone: string; hours: string[]; mw: number[] }[];
  /** When the batch was stored (ISO 8601). */
  receivedAt: string;
}

/** The payload of each event, by name. */
export interface DomainEventPayloads {
  [DOMAIN_EVENTS.readingsStored]: ReadingsStored;
  [DOMAIN_EVENTS.refitProgress]: RefitJobDto;
  [DOMAIN_EVENTS.forecastIssued]: ForecastRunDto;
  [DOMAIN_EVENTS.scheduleChanged]: DeskScheduleEvent;
  [DOMAIN_EVENTS.alertRaised]: AlertDto;
  [DOMAIN_EVENTS.alertAcknowledged]: AlertDto;
  [DOMAIN_EVENTS.sessionEnded]: SessionEnded;
  [DOMAIN_EVENTS.zoneChanged]: ZoneChanged;
}

export type DomainEventName = keyof DomainEventPayloads;
