import { DateTime } from 'luxon';

const HOUR_MS = 3_600_000;

/** One hour of an operating day: its UTC start and its hour-ending label. */
export interface OperatingHour {
  /** UTC hour start, ISO 8601 with Z. */
  hourStart: string;
  /** "HE01".."HE24"; "HE25" on the 25-hour autumn day; no "HE02" on the 23-hour spring day. */
  label: string;
  /** The hour-ending number behind the label. */
  number: number;
}

function toMillis(utcHourStart: string | number | Date): number {
  if (typeof utcHourStart === 'number') return utcHourStart;
  if (utcHourStart instanceof Date) return utcHourStart.getTime();
  return DateTime.fromISO(utcHourStart, { zone: 'utc' }).toMillis();
}

/** Local date (yyyy-MM-dd) of the operating day an hour belongs to: the day its start falls on. */
export function operatingDayOf(utcHourStart: string | number | Date, timeZone: string): string {
  return DateTime.fromMillis(toMillis(utcHourStart), { zone: timeZone }).toISODate() ?? '';
}

/**
 * The hour-ending number of an hour within its operating day (local midnight to local midnight).
 * It is the number of hours elapsed at the hour's end, plus the hour the clock skips when it
 * springs forward: so the spring day runs HE01, HE03..HE24 (no HE02) and the autumn day, whose
 * clock repeats an hour, runs HE01..HE25 without repeating a label.
 */
export function hourEndingNumber(utcHourStart: string | number | Date, timeZone: string): number {
  const start = DateTime.fromMillis(toMillis(utcHourStart), { zone: timeZone });
  const midnight = start.startOf('day');
  const end = start.plus({ hours: 1 });
  const elapsed = Math.round((end.toMillis() - midnight.toMillis()) / HOUR_MS);
  const skipped = Math.max(0, Math.round((end.offset - midnight.offset) / 60));
  return elapsed + skipped;
}

export function hourEndingLabel(utcHourStart: string | number | Date, timeZone: string): string {
  return `HE${String(hourEndingNumber(utcHourStart, timeZone)).padStart(2, '0')}`;
}

/** UTC start of an operating day (local midnight of `date`, yyyy-MM-dd, in `timeZone`). */
export function operatingDayStart(date: string, timeZone: string): number {
  const start = DateTime.fromISO(date, { zone: timeZone }).startOf('day');
  if (!start.isValid) throw new Error(`"${date}" is not a date (yyyy-MM-dd)`);
  return start.toMillis();
}

/** Every hour of an operating day, in order: 24 hours, 23 in spring, 25 in autumn. */
export function operatingDayHours(date: string, timeZone: string): OperatingHour[] {
  const from = operatingDayStart(date, timeZone);
  const to = DateTime.fromMillis(from, { zone: timeZone }).plus({ days: 1 }).startOf('day').toMillis();
  const hours: OperatingHour[] = [];
  for (let t = from; t < to; t += HOUR_MS) {
    const number = hourEndingNumber(t, timeZone);
    hours.push({ hourStart: new Date(t).toISOString(), number, label: `HE${String(number).padStart(2, '0')}` });
  }
  return hours;
}
