/**
 * Operating days, hour-ending labels and gate closure: the one home of these rules for the
 * server and the desk.
 *
 * An operating day is the hours from one local midnight of the zone's time zone to the next:
 * 24 hours, 23 on the day the clocks spring forward, 25 on the day they fall back. Its hours are
 * labelled "hour ending": HE01 is the hour that ends at 01:00 local time. The label is the number
 * of hours elapsed at the hour's end since local midnight, plus the hour the clock skips in
 * spring, so the spring day runs HE01, HE03..HE24 (no HE02) and the autumn day, whose clock
 * repeats an hour, runs HE01..HE25 without repeating a label.
 */
import { DateTime } from 'luxon';
import { HOUR_MS } from './hours';
import { parseDay } from './instant';
import type { ScheduleHourSlot } from './schedules';

/** An hour by its UTC start: epoch ms, a Date, or ISO 8601 text. */
export type HourStart = string | number | Date;

/** One hour of an operating day: its UTC start and its hour-ending label. */
export interface OperatingHour {
  /** UTC hour start, ISO 8601 with Z. */
  hourStart: string;
  /** "HE01".."HE24"; "HE25" on the 25-hour autumn day; no "HE02" on the 23-hour spring day. */
  label: string;
  /** The hour-ending number behind the label. */
  number: number;
}

export interface OperatingDay {
  /** yyyy-MM-dd, local. */
  date: string;
  /** UTC start of the first hour and end of the last (local midnights), epoch ms. */
  start: number;
  end: number;
  /** Hour-ending labels of the day's hours, in order. */
  labels: string[];
}

function toMillis(hour: HourStart): number {
  if (typeof hour === 'number') return hour;
  if (hour instanceof Date) return hour.getTime();
  return DateTime.fromISO(hour, { zone: 'utc' }).toMillis();
}

function notADate(date: string): Error {
  return new Error(`"${date}" is not a date (yyyy-MM-dd)`);
}

/** "HE07" for 7: the label of an hour-ending number. */
export function formatHourEnding(number: number): string {
  return `HE${String(number).padStart(2, '0')}`;
}

/** The hour-ending number of an hour within its operating day (see the top of this file). */
export function hourEndingNumber(hour: HourStart, timeZone: string): number {
  const start = DateTime.fromMillis(toMillis(hour), { zone: timeZone });
  const midnight = start.startOf('day');
  const end = start.plus({ hours: 1 });
  const elapsed = Math.round((end.toMillis() - midnight.toMillis()) / HOUR_MS);
  const skipped = Math.max(0, Math.round((end.offset - midnight.offset) / 60));
  return elapsed + skipped;
}

export function hourEndingLabel(hour: HourStart, timeZone: string): string {
  return formatHourEnding(hourEndingNumber(hour, timeZone));
}

/** Local date (yyyy-MM-dd) of the operating day an hour belongs to: the day its start falls on. */
export function operatingDayOf(hour: HourStart, timeZone: string): string {
  return DateTime.fromMillis(toMillis(hour), { zone: timeZone }).toISODate() ?? '';
}

/**
 * A date written yyyy-MM-dd that exists in the calendar (no 30 February) and lies in the years
 * every entry point accepts (instant.ts: 2000 to 2100).
 */
export function isOperatingDay(date: string): boolean {
  return parseDay(date).ok;
}

/** Local midnight of a yyyy-MM-dd date in a time zone, or null when it is not a real date. */
export function parseOperatingDay(date: string, timeZone: string): DateTime | null {
  if (!isOperatingDay(date)) return null;
  const day = DateTime.fromISO(date, { zone: timeZone }).startOf('day');
  return day.isValid && day.toISODate() === date ? day : null;
}

/** [from, to) of an operating day, UTC epoch ms; throws when `date` is not a real yyyy-MM-dd date. */
export function operatingDayBounds(date: string, timeZone: string): { from: number; to: number } {
  const day = parseOperatingDay(date, timeZone);
  if (!day) throw notADate(date);
  return { from: day.toMillis(), to: day.plus({ days: 1 }).startOf('day').toMillis() };
}

/** UTC start of an operating day (local midnight of `date` in `timeZone`). */
export function operatingDayStart(date: string, timeZone: string): number {
  return operatingDayBounds(date, timeZone).from;
}

/** Every hour of an operating day, in order: 24 hours, 23 in spring, 25 in autumn. */
export function operatingDayHours(date: string, timeZone: string): OperatingHour[] {
  const { from, to } = operatingDayBounds(date, timeZone);
  const hours: OperatingHour[] = [];
  for (let t = from; t < to; t += HOUR_MS) {
    const number = hourEndingNumber(t, timeZone);
    hours.push({ hourStart: new Date(t).toISOString(), number, label: formatHourEnding(number) });
  }
  return hours;
}

/** The hours of an operating day as a schedule lays them out (position, UTC start, label). */
export function operatingDaySlots(date: string, timeZone: string): ScheduleHourSlot[] {
  return operatingDayHours(date, timeZone).map((hour, index) => ({ index, intervalStartUtc: hour.hourStart, hourEnding: hour.label }));
}

export function operatingDay(date: string, timeZone: string): OperatingDay {
  const { from, to } = operatingDayBounds(date, timeZone);
  const labels: string[] = [];
  for (let t = from; t < to; t += HOUR_MS) labels.push(hourEndingLabel(t, timeZone));
  return { date, start: from, end: to, labels };
}

/** Every operating day from `from` to `to`, both included; none when either is not a real date. */
export function operatingDays(from: string, to: string, timeZone: string): OperatingDay[] {
  const out: OperatingDay[] = [];
  let day = parseOperatingDay(from, timeZone);
  const last = parseOperatingDay(to, timeZone);
  if (!day || !last) return out;
  while (day <= last) {
    out.push(operatingDay(day.toISODate()!, timeZone));
    day = day.plus({ days: 1 }).startOf('day');
  }
  return out;
}

/** Days from `from` to `to`, both included (calendar dates, no time zone). */
export function dayCount(from: string, to: string): number {
  return Math.round(DateTime.fromISO(to, { zone: 'utc' }).diff(DateTime.fromISO(from, { zone: 'utc' }), 'days').days) + 1;
}

/**
 * Local midnights of `timeZone` as indices into an hourly series whose index 0 is the UTC hour
 * `firstHourMs` and which has `hours` elements: index i with 0 ≤ i ≤ hours. Consecutive starts
 * are 23, 24 or 25 hours apart (daylight-saving changes), as the engine's backtest expects.
 */
export function operatingDayStarts(firstHourMs: number, hours: number, timeZone: string): { starts: number[]; dates: string[] } {
  const starts: number[] = [];
  const dates: string[] = [];
  let day = DateTime.fromMillis(firstHourMs, { zone: timeZone }).startOf('day');
  const endMs = firstHourMs + hours * HOUR_MS;
  while (day.toMillis() <= endMs) {
    const idx = (day.toMillis() - firstHourMs) / HOUR_MS;
    // a zone whose midnight is not on a UTC hour boundary (half-hour offsets) is not supported
    if (idx >= 0 && Number.isInteger(idx)) {
      starts.push(idx);
      dates.push(day.toISODate() ?? '');
    }
    day = day.plus({ days: 1 }).startOf('day');
  }
  return { starts, dates };
}

/**
 * Gate closure of an operating day, UTC epoch ms: the zone's local time `gateClosure` ("HH:mm")
 * on the day before, whatever the offset that day.
 */
export function gateClosureAt(date: string, timeZone: string, gateClosure: string): number {
  const [hour, minute] = gateClosure.split(':').map(Number);
  const day = parseOperatingDay(date, timeZone);
  if (!day) throw notADate(date);
  return day.minus({ days: 1 }).set({ hour, minute, second: 0, millisecond: 0 }).toMillis();
}
