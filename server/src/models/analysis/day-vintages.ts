/**
 * The temperature forecast vintages known for an operating day, for the what-if's choice of
 * "another vintage": each issue time whose values cover some hour of the day, newest first, with
 * how many of the day's hours it covers, and the one the day's forecast was made on marked — the
 * newest issued at or before the forecast's issue time (the forecast reads the vintage that was
 * the latest when it was issued).
 */
import type { VintageValue } from '../../weather/vintages';

export interface DayVintage {
  issuedAt: number;
  /** hours of the day with a value from this vintage (for at least one of the zone's stations) */
  hours: number;
  usedByForecast: boolean;
}

export function dayVintages(values: readonly VintageValue[], from: number, to: number, forecastIssuedAt: number | null): DayVintage[] {
  const hoursOf = new Map<number, Set<number>>();
  for (const v of values) {
    if (v.hourStart < from || v.hourStart >= to) continue;
    let set = hoursOf.get(v.issuedAt);
    if (!set) hoursOf.set(v.issuedAt, (set = new Set()));
    set.add(v.hourStart);
  }
  const issued = [...hoursOf.keys()].sort((a, b) => b - a);
  const used = forecastIssuedAt === null ? undefined : issued.find((t) => t <= forecastIssuedAt);
  return issued.map((t) => ({ issuedAt: t, hours: hoursOf.get(t)!.size, usedByForecast: t === used }));
}
