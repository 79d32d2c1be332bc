import { DateTime } from 'luxon';

/** yyyy-MM-dd of the day after `now` in `timeZone`: the operating day a day-ahead schedule is for. */
export function tomorrowIn(timeZone: string, now: number = Date.now()): string {
  return DateTime.fromMillis(now, { zone: timeZone }).plus({ days: 1 }).toISODate() ?? '';
}
