/**
 * The demo scenario's weather stations and calendar (invented, like the rest of the Tallowmere
 * Valley: names, places and holidays are fiction). The demo seeder stores them and the simulator
 * makes its temperatures and load from them, so the desk and the simulated world agree.
 */
import type { SpecialDayKind } from './special-days';

export interface DemoStation {
  code: string;
  name: string;
  latitude: number;
  longitude: number;
  elevationM: number;
  /** Mean difference from the valley-floor temperature, °C (higher ground is colder). */
  offsetC: number;
}

export const DEMO_STATIONS: readonly DemoStation[] = [
  { code: 'VALLEYFLOOR', name: 'Valley Floor Airstrip', latitude: 40.214, longitude: -105.482, elevationM: 1580, offsetC: 0 },
  { code: 'COPPERBENCH', name: 'Copper Bench', latitude: 40.251, longitude: -105.437, elevationM: 1690, offsetC: -0.7 },
  { code: 'QUARRYRIDGE', name: 'Quarry Hill Ridge', latitude: 40.168, longitude: -105.561, elevationM: 1960, offsetC: -2.5 },
];

/** Each zone's temperature: a weighted average of these stations. */
export const DEMO_ZONE_STATIONS: Readonly<Record<string, readonly { station: string; weight: number }[]>> = {
  MILLRACE: [{ station: 'VALLEYFLOOR', weight: 1 }],
  COPPERLINE: [{ station: 'COPPERBENCH', weight: 1 }],
  HARROW: [
    { station: 'VALLEYFLOOR', weight: 0.6 },
    { station: 'COPPERBENCH', weight: 0.4 },
  ],
  QUARRY: [{ station: 'QUARRYRIDGE', weight: 1 }],
  LANTERN: [
    { station: 'VALLEYFLOOR', weight: 0.5 },
    { station: 'COPPERBENCH', weight: 0.5 },
  ],
};

/** The valley's public holidays by month and day (invented; near, not on, real dates). */
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

/** Local events of some zones (invented). */
export const VALLEY_LOCAL_EVENTS: readonly { month: number; day: number; name: string; zones: string[] }[] = [
  { month: 9, day: 19, name: 'Copperline Foundry Open Day', zones: ['COPPERLINE'] },
  { month: 11, day: 14, name: 'Lanternside Lantern Walk', zones: ['LANTERN'] },
];

export interface DemoSpecialDay {
  day: string;
  name: string;
  kind: SpecialDayKind;
  /** Empty: every zone. */
  zones: string[];
}

function isoDay(year: number, month: number, day: number): string {
  return new Date(Date.UTC(year, month - 1, day)).toISOString().slice(0, 10);
}

/**
 * The demo calendar of one year: the public holidays; a bridge day on the Monday before a holiday
 * that falls on a Tuesday and on the Friday after one that falls on a Thursday (unless that day
 * is a holiday itself); the local events.
 */
export function demoSpecialDays(year: number): DemoSpecialDay[] {
  const days: DemoSpecialDay[] = VALLEY_HOLIDAYS.map((h) => ({ day: isoDay(year, h.month, h.day), name: h.name, kind: 'public-holiday', zones: [] }));
  const holidays = new Set(days.map((d) => d.day));
  for (const h of VALLEY_HOLIDAYS) {
    const weekday = new Date(Date.UTC(year, h.month - 1, h.day)).getUTCDay();
    const shift = weekday === 2 ? -1 : weekday === 4 ? 1 : 0;
    if (shift === 0) continue;
    const bridge = isoDay(year, h.month, h.day + shift);
    if (holidays.has(bridge) || !bridge.startsWith(String(year))) continue;
    days.push({ day: bridge, name: `Bridge day (${h.name})`, kind: 'bridge-day', zones: [] });
  }
  for (const e of VALLEY_LOCAL_EVENTS) days.push({ day: isoDay(year, e.month, e.day), name: e.name, kind: 'local-event', zones: [...e.zones] });
  return days.sort((a, b) => a.day.localeCompare(b.day) || a.name.localeCompare(b.name));
}

/** The demo calendar of several years, for look-ups by day. */
export function demoSpecialDayIndex(fromYear: number, toYear: number): Map<string, DemoSpecialDay[]> {
  const index = new Map<string, DemoSpecialDay[]>();
  for (let year = fromYear; year <= toYear; year++) {
    for (const d of demoSpecialDays(year)) {
      const list = index.get(d.day);
      if (list) list.push(d);
      else index.set(d.day, [d]);
    }
  }
  return index;
}
