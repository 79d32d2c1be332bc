import { DateTime } from 'luxon';

/** "14:05" in the desk's time zone (the shift pattern's), where the shift's wall clock runs. */
export function formatClock(iso: string, timeZone: string): string {
  const value = DateTime.fromISO(iso, { zone: timeZone });
  return value.isValid ? value.toFormat('HH:mm') : '—';
}

/** "Tue 3 Mar 14:05" in the desk's time zone. */
export function formatDayClock(iso: string, timeZone: string): string {
  const value = DateTime.fromISO(iso, { zone: timeZone });
  return value.isValid ? value.toFormat('ccc d LLL HH:mm') : '—';
}
