import { WEEK_HOURS } from '@morrowline/shared';
import { DateTime } from 'luxon';
import { BAND_WEEKS } from './week-earlier-line';

export interface LiveWindow {
  /** Readings are fetched from here: a week for the week-earlier line's lag and weeks for its bands. */
  historyFrom: string;
  /** The chart starts at local midnight two days before today: the last three operating days. */
  displayFrom: string;
  /** End of the coming operating day (local midnight after tomorrow). */
  to: string;
}

export const PAST_DAYS_SHOWN = 2;

/** The live view's range for a zone's time zone at a given moment. */
export function liveWindow(now: number, timeZone: string): LiveWindow {
  const today = DateTime.fromMillis(now, { zone: timeZone }).startOf('day');
  const displayFrom = today.minus({ days: PAST_DAYS_SHOWN });
  const historyFrom = displayFrom.minus({ hours: WEEK_HOURS * (BAND_WEEKS + 1) });
  const to = today.plus({ days: 2 }).startOf('day');
  const iso = (d: DateTime) => d.toUTC().toISO({ suppressMilliseconds: false }) as string;
  return { historyFrom: iso(historyFrom), displayFrom: iso(displayFrom), to: iso(to) };
}
