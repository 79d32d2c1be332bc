import { formatLocalClock, formatLocalDayClock } from '@morrowline/shared';

/** "14:05 MST" in the desk's time zone (the shift pattern's), where the shift's wall clock runs. */
export function formatClock(iso: string, timeZone: string): string {
  return formatLocalClock(iso, timeZone);
}

/** "Tue 3 Mar 14:05 MST" in the desk's time zone. */
export function formatDayClock(iso: string, timeZone: string): string {
  return formatLocalDayClock(iso, timeZone);
}
