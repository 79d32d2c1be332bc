/**
 * A zone code, e.g. MILLRACE: a capital letter, then 1 to 31 capital letters, digits, - or _.
 * Readings, feeds and schedules name zones by it, so it never changes once a zone exists.
 */
export const ZONE_CODE_PATTERN = /^[A-Z][A-Z0-9_-]{1,31}$/;

/** The rule in words, for a form that asks for a new code. */
export const ZONE_CODE_RULE = 'Capital letters, digits, - or _, 2 to 32 characters, starting with a letter';

export function isZoneCode(value: unknown): value is string {
  return typeof value === 'string' && ZONE_CODE_PATTERN.test(value);
}
