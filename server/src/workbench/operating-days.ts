import { DateTime } from 'luxon';

const HOUR_MS = 3_600_000;

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
