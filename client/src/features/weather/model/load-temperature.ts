import type { ReadingSeriesDto, ZoneWeatherSeriesDto } from '@morrowline/shared';
import { DateTime } from 'luxon';

/** Hour groups of the scatter, by local hour of the hour's start: the load answers weather differently by time of day. */
export const HOUR_GROUPS = [
  { key: 'night', label: 'Night (00–06)', from: 0, to: 6 },
  { key: 'morning', label: 'Morning (06–12)', from: 6, to: 12 },
  { key: 'afternoon', label: 'Afternoon (12–18)', from: 12, to: 18 },
  { key: 'evening', label: 'Evening (18–24)', from: 18, to: 24 },
] as const;

export type HourGroup = (typeof HOUR_GROUPS)[number]['key'];

export interface LoadTemperaturePoint {
  tempC: number;
  mw: number;
  group: HourGroup;
}

/** Each hour with both a reading and an observed temperature of the zone, with its hour group. */
export function loadTemperaturePoints(readings: ReadingSeriesDto | undefined, weather: ZoneWeatherSeriesDto | undefined, zone: string, timeZone: string): LoadTemperaturePoint[] {
  const load = readings?.zones.find((z) => z.zone === zone);
  const temps = weather?.zones.find((z) => z.zone === zone);
  if (!readings || !load || !weather || !temps) return [];
  const tempAt = new Map(weather.hours.map((h, i) => [Date.parse(h), temps.observedC[i]]));
  const points: LoadTemperaturePoint[] = [];
  readings.hours.forEach((h, i) => {
    const ms = Date.parse(h);
    const mw = load.mw[i];
    const tempC = tempAt.get(ms);
    if (mw === null || tempC === null || tempC === undefined) return;
    const hour = DateTime.fromMillis(ms, { zone: timeZone }).hour;
    points.push({ tempC, mw, group: HOUR_GROUPS.find((g) => hour >= g.from && hour < g.to)!.key });
  });
  return points;
}
