import { DateTime } from 'luxon';
import type { ScheduleHourSlot } from '@morrowline/shared';

const HOUR_MS = 3_600_000;

/**
 * Operating days and hour-ending labels, the same rule as the desks' client/src/lib/hour-ending.ts:
 * the label is the hours elapsed at the hour's end since local midnight plus the hour the clock
 * skips in spring. So the spring day runs HE01, HE03..HE24 (23 hours) and the autumn day
 * HE01..HE25 (25 hours, no label repeated).
 */
export function hourEndingNumber(startMs: number, timeZone: string): number {
  const start = DateTime.fromMillis(startMs, { zone: timeZone });
  const midnight = start.startOf('day');
  const end = start.plus({ hours: 1 });
  const elapsed = Math.round((end.toMillis() - midnight.toMillis()) / HOUR_MS);
  const skipped = Math.max(0, Math.round((end.offset - midnight.offset) / 60));
  return elapsed + skipped;
}

export function isOperatingDay(day: string): boolean {
  return /^\d{4}-\d{2}-\d{2}$/.test(day) && DateTime.fromISO(day, { zone: 'utc' }).isValid;
}

/** [start, end) of an operating day, UTC ms. */
export function operatingDayBounds(day: string, timeZone: string): { from: number; to: number } {
  const start = DateTime.fromISO(day, { zone: timeZone }).startOf('day');
  if (!start.isValid || !isOperatingDay(day)) throw new Error(`"${day}" is not a date (yyyy-MM-dd)`);
  return { from: start.toMillis(), to: start.plus({ days: 1 }).startOf('day').toMillis() };
}

/** Every hour of the operating day in order: 24, or 23 / 25 at the daylight-saving changes. */
export function operatingDaySlots(day: string, timeZone: string): ScheduleHourSlot[] {
  const { from, to } = operatingDayBounds(day, timeZone);
  const slots: ScheduleHourSlot[] = [];
  for (let t = from, index = 0; t < to; t += HOUR_MS, index++) {
    slots.push({ index, intervalStartUtc: new Date(t).toISOString(), hourEnding: `HE${String(hourEndingNumber(t, timeZone)).padStart(2, '0')}` });
  }
  return slots;
}

/** Gate closure: local time "HH:mm" on the day before the operating day. */
export function gateClosureAt(day: string, timeZone: string, gateClosure: string): Date {
  const [hour, minute] = gateClosure.split(':').map(Number);
  const at = DateTime.fromISO(day, { zone: timeZone }).minus({ days: 1 }).set({ hour, minute, second: 0, millisecond: 0 });
  return at.toJSDate();
}
