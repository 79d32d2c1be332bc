import { DateTime } from 'luxon';
import { gateClosureAt, HOUR_MS, operatingDayBounds, operatingDayOf } from '@morrowline/shared';
import type { ScoredDay } from './issue-time-score';

/** Operating days every version of a zone is scored on: the last whole days the history holds. */
export const COMPARE_DAYS = 7;

export interface ScoringDay extends ScoredDay {
  /** yyyy-MM-dd in the zone's time zone */
  day: string;
  from: number;
  to: number;
  /** the day's issue time: the zone's gate closure on the day before (UTC ms) */
  issuedAt: number;
}

/**
 * The last `count` operating days that ended by the end of the latest reading, oldest first, each
 * with its issue time (the gate closure) and the cut: the hours that had ended by then. Days
 * whose issue time lies before the history's first hour are left out.
 */
export function scoringDays(firstHourMs: number, lastHourMs: number, timeZone: string, gateClosure: string, count = COMPARE_DAYS): ScoringDay[] {
  const end = lastHourMs + HOUR_MS;
  let day = DateTime.fromISO(operatingDayOf(lastHourMs, timeZone), { zone: timeZone });
  const out: ScoringDay[] = [];
  for (let guard = 0; out.length < count && guard < count + 3; guard++, day = day.minus({ days: 1 })) {
    const date = day.toISODate() as string;
    const { from, to } = operatingDayBounds(date, timeZone);
    if (to > end) continue;
    const issuedAt = gateClosureAt(date, timeZone, gateClosure);
    if (issuedAt <= firstHourMs) break;
    out.push({ day: date, from, to, issuedAt, dayStart: (from - firstHourMs) / HOUR_MS, hours: (to - from) / HOUR_MS, cut: Math.floor((issuedAt - firstHourMs) / HOUR_MS) });
  }
  return out.reverse();
}
