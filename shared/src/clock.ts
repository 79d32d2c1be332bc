/**
 * The one clock rule of the desk, for every screen, e-mail and the human-readable parts of
 * exports: a moment is written in the local time of a zone (a load zone's, or the desk's) and
 * always carries that zone's abbreviation, "2026-12-02 08:18 MST". UTC is written only where the
 * text says "UTC", "2026-12-02 15:18 UTC". Machine-readable fields (API bodies, CSV timestamp
 * columns) stay ISO 8601 and are not this file's business.
 */
import { DateTime } from 'luxon';

/** A moment: epoch ms, a Date, or ISO 8601 text with an offset or Z. */
export type Instant = string | number | Date;

/** Abbreviations are looked up in one locale, so every reader sees "MST", not a localised name. */
const LOCALE = 'en-US';

function toDateTime(at: Instant | null | undefined, timeZone: string): DateTime | null {
  if (at === null || at === undefined || at === '') return null;
  const value =
    typeof at === 'number'
      ? DateTime.fromMillis(at, { zone: timeZone })
      : at instanceof Date
        ? DateTime.fromJSDate(at, { zone: timeZone })
        : DateTime.fromISO(at, { zone: timeZone, setZone: false });
  return value.isValid ? value.setLocale(LOCALE) : null;
}

/**
 * The zone's abbreviation at that moment: "MST" in winter and "MDT" in summer for
 * America/Denver. Where the platform knows no abbreviation it gives the offset ("GMT+1").
 */
export function timeZoneAbbreviation(at: Instant, timeZone: string): string {
  return toDateTime(at, timeZone)?.toFormat('ZZZZ') ?? '';
}

/** "2026-12-02 08:18 MST": local date, time and abbreviation; "—" when there is no moment. */
export function formatLocalTime(at: Instant | null | undefined, timeZone: string): string {
  const value = toDateTime(at, timeZone);
  return value ? value.toFormat('yyyy-LL-dd HH:mm ZZZZ') : '—';
}

/** "08:18 MST": local time of day with the abbreviation, for a moment whose day is already said. */
export function formatLocalClock(at: Instant | null | undefined, timeZone: string): string {
  const value = toDateTime(at, timeZone);
  return value ? value.toFormat('HH:mm ZZZZ') : '—';
}

/** "Wed 2 Dec 08:18 MST": a short day and time with the abbreviation. */
export function formatLocalDayClock(at: Instant | null | undefined, timeZone: string): string {
  const value = toDateTime(at, timeZone);
  return value ? value.toFormat('ccc d LLL HH:mm ZZZZ') : '—';
}

/** "2026-12-02 15:18 UTC": only for text that is labelled UTC. */
export function formatUtcTime(at: Instant | null | undefined): string {
  const value = toDateTime(at, 'utc');
  return value ? `${value.toFormat('yyyy-LL-dd HH:mm')} UTC` : '—';
}

/** GET /api/clock: the desk's own time zone, for moments that belong to no load zone (sign-ins, the audit trail). */
export interface DeskClockDto {
  /** IANA time zone of the desk (its shift pattern's), e.g. America/Denver. */
  deskTimeZone: string;
}
