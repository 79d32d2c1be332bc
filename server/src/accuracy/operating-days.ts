import { DateTime } from 'luxon';

const HOUR_MS = 3_600_000;

export interface OperatingDay {
  /** yyyy-MM-dd, local. */
  date: string;
  /** UTC start of the first hour and end of the last (local midnights). */
  start: number;
  end: number;
  /** Hour-ending labels of the day's hours, in order (see shared/src/schedules.ts). */
  labels: string[];
}

/** Hour-ending number: hours elapsed at the hour's end plus the hour the clock skips in spring. */
export function hourEndingNumber(hourStart: number, timeZone: string): number {
  const start = DateTime.fromMillis(hourStart, { zone: timeZone });
  const midnight = start.startOf('day');
  const end = start.plus({ hours: 1 });
  const elapsed = Math.round((end.toMillis() - midnight.toMillis()) / HOUR_MS);
  const skipped = Math.max(0, Math.round((end.offset - midnight.offset) / 60));
  return elapsed + skipped;
}

export function hourEndingLabel(hourStart: number, timeZone: string): string {
  return `HE${String(hourEndingNumber(hourStart, timeZone)).padStart(2, '0')}`;
}

/** A yyyy-MM-dd date in a time zone, or null when it is not a real date. */
export function parseDay(date: string, timeZone: string): DateTime | null {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(date)) return null;
  const d = DateTime.fromISO(date, { zone: timeZone }).startOf('day');
  return d.isValid && d.toISODate() === date ? d : null;
}

export function operatingDay(date: string, timeZone: string): OperatingDay {
  const day = parseDay(date, timeZone);
  if (!day) throw new Error(`"${date}" is not a date (yyyy-MM-dd)`);
  const start = day.toMillis();
  const end = day.plus({ days: 1 }).startOf('day').toMillis();
  const labels: string[] = [];
  for (let t = start; t < end; t += HOUR_MS) labels.push(hourEndingLabel(t, timeZone));
  return { date, start, end, labels };
}

/** Every operating day from `from` to `to`, both included. */
export function operatingDays(from: string, to: string, timeZone: string): OperatingDay[] {
  const out: OperatingDay[] = [];
  let d = parseDay(from, timeZone);
  const last = parseDay(to, timeZone);
  if (!d || !last) return out;
  while (d <= last) {
    out.push(operatingDay(d.toISODate()!, timeZone));
    d = d.plus({ days: 1 }).startOf('day');
  }
  return out;
}

/** Days from `from` to `to`, both included (calendar dates, no time zone). */
export function dayCount(from: string, to: string): number {
  return Math.round(DateTime.fromISO(to, { zone: 'utc' }).diff(DateTime.fromISO(from, { zone: 'utc' }), 'days').days) + 1;
}

/** Gate closure of an operating day: "HH:mm" local time on the day before. */
export function gateClosureAt(date: string, timeZone: string, gateClosure: string): number {
  const [h, m] = gateClosure.split(':').map(Number);
  const day = parseDay(date, timeZone);
  if (!day) throw new Error(`"${date}" is not a date (yyyy-MM-dd)`);
  return day.minus({ days: 1 }).set({ hour: h, minute: m, second: 0, millisecond: 0 }).toMillis();
}
