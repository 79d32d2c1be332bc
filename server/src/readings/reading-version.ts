import { MAX_VERSION_AHEAD_US, MIN_READING_VERSION } from '@morrowline/shared';

export type VersionCheck = { ok: true; version: number | null } | { ok: false; message: string };

/**
 * Checks a reading's `version` (see FeedReading.version): absent means "the latest at storing";
 * otherwise a whole number of microseconds from 2000-01-01 to a day past the server's clock.
 * Pure: the clock is passed in.
 */
export function checkVersion(raw: unknown, nowMs: number): VersionCheck {
  if (typeof raw !== 'object' || raw === null || !('version' in raw)) return { ok: true, version: null };
  const version = (raw as { version: unknown }).version;
  if (version === undefined) return { ok: true, version: null };
  if (typeof version !== 'number' || !Number.isSafeInteger(version)) {
    return { ok: false, message: 'version must be a whole number: microseconds since 1970-01-01T00:00Z when the value was produced' };
  }
  const latest = nowMs * 1000 + MAX_VERSION_AHEAD_US;
  if (version < MIN_READING_VERSION || version > latest) {
    return { ok: false, message: `version ${version} is not a time in microseconds between 2000-01-01 and a day past the server's clock (${Math.floor(nowMs * 1000)})` };
  }
  return { ok: true, version };
}
