/**
 * Local time in the cooperative's time zone and its public holidays. The holidays are invented
 * for the Tallowmere Valley (near, not on, real calendar dates).
 */
const formatters = new Map<string, Intl.DateTimeFormat>();

export interface LocalTime {
  year: number;
  month: number;
  day: number;
  hour: number;
  /** 0 = Sunday … 6 = Saturday. */
  weekday: number;
  dayOfYear: number;
}

const WEEKDAYS: Record<string, number> = { Sun: 0, Mon: 1, Tue: 2, Wed: 3, Thu: 4, Fri: 5, Sat: 6 };

export function localTime(ms: number, timeZone: string): LocalTime {
  let format = formatters.get(timeZone);
  if (!format) {
    format = new Intl.DateTimeFormat('en-US', { timeZone, year: 'numeric', month: 'numeric', day: 'numeric', hour: 'numeric', hourCycle: 'h23', weekday: 'short' });
    formatters.set(timeZone, format);
  }
  const parts: Record<string, string> = {};
  for (const part of format.formatToParts(new Date(ms))) parts[part.type] = part.value;
  const year = Number(parts.year);
  const month = Number(parts.month);
  const day = Number(parts.day);
  const dayOfYear = Math.round((Date.UTC(year, month - 1, day) - Date.UTC(year, 0, 1)) / 86_400_000) + 1;
  return { year, month, day, hour: Number(parts.hour), weekday: WEEKDAYS[parts.weekday], dayOfYear };
}

/** Month and day of the valley's public holidays (invented). */
export const VALLEY_HOLIDAYS: readonly { month: number; day: number; name: string }[] = [
  { month: 1, day: 2, name: 'New Year Rest Day' },
  { month: 3, day: 14, name: 'Founders of the Cooperative Day' },
  { month: 5, day: 27, name: 'Valley Remembrance Day' },
  { month: 7, day: 5, name: 'Midsummer Holiday' },
  { month: 9, day: 3, name: 'Harvest Labour Day' },
  { month: 10, day: 16, name: 'Tallow Fair Day' },
  { month: 11, day: 25, name: 'Thanksgiving Rest Day' },
  { month: 12, day: 24, name: 'Winter Eve' },
  { month: 12, day: 25, name: 'Winter Feast' },
];

export function isHoliday(t: LocalTime): boolean {
  return VALLEY_HOLIDAYS.some((h) => h.month === t.month && h.day === t.day);
}
