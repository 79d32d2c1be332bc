import { DateTime } from 'luxon';

export interface LiveWindow {
  /** The chart starts at local midnight two days before today: the last three operating days. */
  displayFrom: string;
  /** Local midnight starting today's operating day. */
  todayFrom: string;
  /** End of the coming operating day (local midnight after tomorrow). */
  to: string;
}

export const PAST_DAYS_SHOWN = 2;

/** The live view's range for a zone's time zone at a given moment. */
export function liveWindow(now: number, timeZone: string): LiveWindow {
  const today = DateTime.fromMillis(now, { zone: timeZone }).startOf('day');
  const displayFrom = today.minus({ days: PAST_DAYS_SHOWN });
  const to = today.plus({ days: 2 }).startOf('day');
  const iso = (d: DateTime) => d.toUTC().toISO({ suppressMilliseconds: false }) as string;
  return { displayFrom: iso(displayFrom), todayFrom: iso(today), to: iso(to) };
}
