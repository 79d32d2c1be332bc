/**
 * The one parser of times and operating days for every entry point: the meter feed, CSV uploads
 * and every API field or query that names an instant or a day.
 *
 * An instant is ISO 8601 / RFC 3339 date-time text with an explicit offset:
 * `YYYY-MM-DDThh:mm[:ss[.fff]]` then `Z` or `±hh:mm` (a space may stand for the `T`). Each field
 * is checked against the calendar rather than rolled over: 2023-02-30, 24:00 and 10:60 are
 * refused, never read as the next day or hour, and a time without an offset is refused because it
 * would be read in whatever time zone the reader happens to run in.
 *
 * Both instants and days must fall in the window below (years 2000 to 2100, UTC): outside it a
 * date is a typing error (0000-01-01, 9999-12-31), not load history or a schedule.
 */

/** First and last year any instant or operating day may have (UTC for instants). */
export const FIRST_YEAR = 2000;
export const LAST_YEAR = 2100;
/** The window in words, for messages and the API docs. */
export const TIME_WINDOW_RULE = `years ${FIRST_YEAR} to ${LAST_YEAR}`;
/** An example of what the parser accepts, for messages. */
export const INSTANT_EXAMPLE = '2026-03-08T09:00:00Z';

/** A parse answer: the value, or a message that says what is wrong with the text. */
export type Parsed<T> = { ok: true; value: T } | { ok: false; message: string };

const INSTANT = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2})(\.\d{1,9})?)?(?:(Z)|([+-])(\d{2}):(\d{2}))$/;
/** The same form without the offset: told apart to say what is missing. */
const NO_OFFSET = /^\d{4}-\d{2}-\d{2}[T ]\d{2}:\d{2}(?::\d{2}(\.\d{1,9})?)?$/;
const DAY = /^(\d{4})-(\d{2})-(\d{2})$/;
/** Offsets in use on Earth run from −12:00 to +14:00. */
const MAX_OFFSET_MINUTES = 14 * 60;

const WINDOW_FROM = Date.UTC(FIRST_YEAR, 0, 1);
const WINDOW_TO = Date.UTC(LAST_YEAR + 1, 0, 1);

function fail<T>(message: string): Parsed<T> {
  return { ok: false, message };
}

/** Quoted, and cut short, so a message never repeats a whole hostile string. */
function quote(text: string): string {
  return JSON.stringify(text.length > 40 ? `${text.slice(0, 40)}…` : text);
}

const MONTH_DAYS = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

/** Days in a month (1–12) of the proleptic Gregorian calendar. */
export function daysInMonth(year: number, month: number): number {
  if (month === 2) return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0 ? 29 : 28;
  return MONTH_DAYS[month - 1] ?? 0; // no such month: no day of it exists
}

/** Month and day checked against the calendar; null when the date exists. */
function calendarProblem(field: string, text: string, year: number, month: number, day: number): string | null {
  if (month < 1 || month > 12) return `${field} ${quote(text)} has no month ${month}`;
  if (day < 1 || day > daysInMonth(year, month)) return `${field} ${quote(text)} is not a real date: ${year}-${String(month).padStart(2, '0')} has no day ${day}`;
  return null;
}

/**
 * An instant as UTC epoch milliseconds. `field` names the value in the message
 * ("hour", "start", …).
 */
export function parseInstant(text: unknown, field = 'time'): Parsed<number> {
  if (typeof text !== 'string') return fail(`${field} must be an ISO 8601 date and time with an offset, e.g. ${INSTANT_EXAMPLE}`);
  const m = INSTANT.exec(text);
  if (!m && NO_OFFSET.test(text)) return fail(`${field} ${quote(text)} has no offset: add Z or ±hh:mm (without one it would be read in whatever time zone the reader runs in)`);
  if (!m) return fail(`${field} must be an ISO 8601 date and time`);
  const year = Number(m[1]);
  const month = Number(m[2]);
  const day = Number(m[3]);
  const hour = Number(m[4]);
  const minute = Number(m[5]);
  const second = m[6] === undefined ? 0 : Number(m[6]);
  const fraction = m[7] === undefined ? 0 : Number(m[7]);
  const calendar = calendarProblem(field, text, year, month, day);
  if (calendar) return fail(calendar);
  if (hour > 23) return fail(`${field} ${quote(text)} has hour ${hour}: hours run 00 to 23 (midnight is 00:00 of the next day)`);
  if (minute > 59) return fail(`${field} ${quote(text)} has minute ${minute}: minutes run 00 to 59`);
  if (second > 59) return fail(`${field} ${quote(text)} has second ${second}: seconds run 00 to 59`);
  let offsetMinutes = 0;
  if (m[8] !== 'Z') {
    const offsetHours = Number(m[10]);
    const offsetMins = Number(m[11]);
    if (offsetMins > 59) return fail(`${field} ${quote(text)} has an offset with minute ${offsetMins}`);
    offsetMinutes = (offsetHours * 60 + offsetMins) * (m[9] === '-' ? -1 : 1);
    if (Math.abs(offsetMinutes) > MAX_OFFSET_MINUTES) return fail(`${field} ${quote(text)} has an offset beyond ±14:00`);
  }
  const ms = Date.UTC(year, month - 1, day, hour, minute, second) + Math.round(fraction * 1000) - offsetMinutes * 60_000;
  if (!(ms >= WINDOW_FROM && ms < WINDOW_TO)) return fail(`${field} ${quote(text)} is outside the accepted ${TIME_WINDOW_RULE} (UTC)`);
  return { ok: true, value: ms };
}

/** An operating day, `YYYY-MM-DD`, a real date in the window; answers the text itself. */
export function parseDay(text: unknown, field = 'day'): Parsed<string> {
  const rule = `${field} must be an operating day, YYYY-MM-DD`;
  if (typeof text !== 'string') return fail(rule);
  const m = DAY.exec(text);
  if (!m) return fail(`${rule}: ${quote(text)} is not in that form`);
  const [year, month, day] = [m[1], m[2], m[3]].map(Number);
  if (month < 1 || month > 12) return fail(`${rule}: ${quote(text)} has no month ${month}`);
  if (day < 1 || day > daysInMonth(year, month)) return fail(`${rule}: ${quote(text)} is not a real date (${m[1]}-${m[2]} has no day ${day})`);
  if (year < FIRST_YEAR || year > LAST_YEAR) return fail(`${rule}: ${quote(text)} is outside the accepted ${TIME_WINDOW_RULE}`);
  return { ok: true, value: text };
}

/** True for text parseInstant accepts. */
export function isInstant(text: unknown): text is string {
  return parseInstant(text).ok;
}

/** True for text parseDay accepts. */
export function isDay(text: unknown): text is string {
  return parseDay(text).ok;
}
