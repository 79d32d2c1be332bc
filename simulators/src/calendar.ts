/**
 * Local time in the cooperative's time zone, and the valley's calendar: the same special days the
 * desk is seeded with (shared/src/demo-weather.ts), so the simulated load and the desk's calendar
 * agree.
 */
import { demoSpecialDays, isRestDayKind, type DemoSpecialDay } from '@morrowline/shared';

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

const byYear = new Map<number, Map<string, DemoSpecialDay[]>>();

/** The special days of a local date. */
export function specialDaysOn(t: LocalTime): DemoSpecialDay[] {
  let index = byYear.get(t.year);
  if (!index) {
    index = new Map();
    for (const d of demoSpecialDays(t.year)) (index.get(d.day) ?? index.set(d.day, []).get(d.day)!).push(d);
    byYear.set(t.year, index);
  }
  const key = `${t.year}-${String(t.month).padStart(2, '0')}-${String(t.day).padStart(2, '0')}`;
  return index.get(key) ?? [];
}

/** Whether a zone rests on this local date: a public holiday or a bridge day that applies to it. */
export function isRestDay(t: LocalTime, zone: string): boolean {
  return specialDaysOn(t).some((d) => isRestDayKind(d.kind) && (d.zones.length === 0 || d.zones.includes(zone)));
}
