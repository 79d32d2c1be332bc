import { HOUR_MS, parseInstant } from '@morrowline/shared';
import type { ReadingQuality, ReadingRejection, RejectionReason } from '@morrowline/shared';
import { READING_QUALITIES } from './entities/reading.entity';

/** What validation needs to know about a zone. */
export interface ZoneLimits {
  id: number;
  code: string;
  minPlausibleMw: number;
  maxPlausibleMw: number;
}

export interface ValidationContext {
  zones: ReadonlyMap<string, ZoneLimits>;
  /** Server clock, ms. */
  now: number;
  /** A feed key limited to one zone. */
  allowedZone?: string | null;
}

/** A reading that passed every check, normalised to the UTC hour start in ms. */
export interface ValidReading {
  zoneId: number;
  zone: string;
  hourStart: number;
  mw: number;
  quality: ReadingQuality;
}

export type ValidationResult = { ok: true; reading: ValidReading } | { ok: false; reason: RejectionReason; message: string };

/** How far ahead of the current hour a reading may be: one hour, for clock differences. */
export const MAX_FUTURE_HOURS = 1;

function reject(reason: RejectionReason, message: string): ValidationResult {
  return { ok: false, reason, message };
}

/** Checks one reading as a feed or a CSV row sent it. Pure: no database, no clock of its own. */
export function validateReading(raw: unknown, context: ValidationContext): ValidationResult {
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) return reject('malformed', 'A reading must be an object with zone, hour and mw');
  const { zone, hour, mw, quality } = raw as Record<string, unknown>;
  if (typeof zone !== 'string' || zone.length === 0) return reject('malformed', 'zone must be a zone code');
  // The one time parser: an offset is required, 30 February or 24:00 is refused (never rolled
  // over onto a real hour), and the year must lie in the documented window.
  const parsed = parseInstant(hour, 'hour');
  if (!parsed.ok) return reject('malformed', parsed.message);
  const at = parsed.value;
  if (quality !== undefined && quality !== null && !(READING_QUALITIES as readonly unknown[]).includes(quality)) {
    return reject('malformed', `quality must be one of ${READING_QUALITIES.join(', ')}`);
  }
  const limits = context.zones.get(zone);
  if (!limits) return reject('unknown-zone', `No zone with code ${zone.slice(0, 40)}`);
  if (context.allowedZone && context.allowedZone !== zone) {
    return reject('zone-not-allowed', `This feed key may only send readings for ${context.allowedZone}`);
  }
  if (at % HOUR_MS !== 0) return reject('not-on-the-hour', `hour ${hour} is not the start of an hour`);
  if (typeof mw !== 'number' || !Number.isFinite(mw)) return reject('not-a-number', 'mw must be a finite number of megawatts');
  if (mw < 0) return reject('negative', `mw ${mw} is negative`);
  if (mw < limits.minPlausibleMw || mw > limits.maxPlausibleMw) {
    return reject('implausible', `mw ${mw} is outside ${zone}'s plausible range ${limits.minPlausibleMw}–${limits.maxPlausibleMw} MW`);
  }
  const currentHour = Math.floor(context.now / HOUR_MS) * HOUR_MS;
  if (at > currentHour + MAX_FUTURE_HOURS * HOUR_MS) {
    return reject('too-far-in-future', `hour ${hour} lies in the future; readings are for hours that have begun`);
  }
  return { ok: true, reading: { zoneId: limits.id, zone, hourStart: at, mw, quality: (quality as ReadingQuality | undefined) ?? 'good' } };
}

/** Validates a batch, answering the good readings and a rejection per bad one (by index). */
export function validateBatch(raws: readonly unknown[], context: ValidationContext): { valid: ValidReading[]; indexes: number[]; rejected: ReadingRejection[] } {
  const valid: ValidReading[] = [];
  const indexes: number[] = [];
  const rejected: ReadingRejection[] = [];
  raws.forEach((raw, index) => {
    const result = validateReading(raw, context);
    if (result.ok) {
      valid.push(result.reading);
      indexes.push(index);
    } else {
      rejected.push({ index, reason: result.reason, message: result.message });
    }
  });
  return { valid, indexes, rejected };
}
