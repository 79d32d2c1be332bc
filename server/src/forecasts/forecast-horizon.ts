import { DateTime } from 'luxon';
import { HOUR_MS } from '@morrowline/shared';

/** A history that stopped long ago still gets a bounded forecast. */
export const MAX_HORIZON_HOURS = 14 * 24;

/**
 * Hours to forecast after the last reading: the rest of today and the whole next operating day
 * of the zone (to the local midnight after tomorrow, so 23- and 25-hour days come out right).
 */
export function forecastHorizon(lastHourMs: number, timeZone: string, now = Date.now()): number {
  const end = DateTime.fromMillis(now, { zone: timeZone }).startOf('day').plus({ days: 2 }).startOf('day').toMillis();
  const hours = Math.round((end - (lastHourMs + HOUR_MS)) / HOUR_MS);
  return Math.min(MAX_HORIZON_HOURS, Math.max(24, hours));
}
