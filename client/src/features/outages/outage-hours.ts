import type { OutageDto } from '@morrowline/shared';

/**
 * Which of `hours` (UTC hour starts) fall in a window: flags for a chart. An open window runs to
 * `nowMs` and beyond (its end is not known yet).
 */
export function outageHoursOf(hours: readonly string[], outages: readonly OutageDto[]): boolean[] {
  const windows = outages.map((o) => [Date.parse(o.start), o.end ? Date.parse(o.end) : Infinity] as const);
  return hours.map((hour) => {
    const at = Date.parse(hour);
    return windows.some(([from, to]) => at >= from && at < to);
  });
}
