/**
 * A zone's weather and calendar on the timeline of its load history, as the engine's weather
 * pipeline reads them (engine/src/weather): hour index i is the hour that starts i hours after
 * the history's first hour, an issue time is fractional hours from that start.
 *
 * - Observed temperature: per hour, the weighted average of the zone's stations (shared
 *   weightedTemperature; an hour a station lacks is NaN, never a partial average).
 * - Forecast vintages: one per distinct issue time. A vintage issued at I holds, for the hours
 *   that some station's forecast issued at I covers, the weighted average over the stations of
 *   the newest value issued at or before I (the rule of vintages.knownAt), so a zone whose stations issue at
 *   slightly different times still gets one path per issue, and nothing issued after I enters it.
 * - Calendar: local hour of day and weekday in the zone's time zone, and public holidays and
 *   bridge days from the special-day calendar (days for every zone or naming this one).
 */
import { DateTime } from 'luxon';
import { HOUR_MS, weightedTemperature, type SpecialDayDto } from '@morrowline/shared';
import type { CalendarHours, TemperatureVintage } from '@morrowline/engine';
import { vintageKey, type VintageValue } from '../../weather/vintages';

export interface ZoneWeatherRows {
  zone: string;
  timeZone: string;
  /** the history's first hour (UTC ms) and its length; the calendar also covers `horizon` hours after it */
  firstHourMs: number;
  hours: number;
  horizon: number;
  stationIds: number[];
  weights: number[];
  observed: ReadonlyArray<{ stationId: number; hourStart: number; tempC: number }>;
  /** central forecast values, only those issued at or before the issue time */
  forecasts: readonly VintageValue[];
  specialDays: readonly SpecialDayDto[];
}

export interface ZoneWeatherInputs {
  temperature: Float64Array;
  vintages: TemperatureVintage[];
  calendar: CalendarHours;
  /** hours of the history with an observed zone temperature */
  observedHours: number;
}

export function zoneWeatherInputs(rows: ZoneWeatherRows): ZoneWeatherInputs {
  const { firstHourMs, hours, horizon, stationIds, weights } = rows;
  const index = (ms: number) => Math.round((ms - firstHourMs) / HOUR_MS);

  const observedBy = new Map(rows.observed.map((o) => [vintageKey(o.stationId, o.hourStart), o.tempC]));
  const temperature = new Float64Array(hours).fill(NaN);
  let observedHours = 0;
  for (let i = 0; i < hours; i++) {
    const t = weightedTemperature(
      stationIds.map((id) => observedBy.get(vintageKey(id, firstHourMs + i * HOUR_MS))),
      weights,
    );
    if (t !== null) {
      temperature[i] = t;
      observedHours++;
    }
  }

  // Issues in order; the newest value per station and hour is kept up to date as each issue's
  // rows are applied, so at issue I it holds exactly what knownAt(values, I) would (one pass over
  // the rows rather than one per issue: 16-day vintages twice a day from three stations are
  // about 130,000 rows for eight weeks).
  const byIssue = new Map<number, VintageValue[]>();
  for (const f of rows.forecasts) (byIssue.get(f.issuedAt) ?? byIssue.set(f.issuedAt, []).get(f.issuedAt)!).push(f);
  const latest = new Map<string, number>();
  const vintages: TemperatureVintage[] = [];
  for (const issued of [...byIssue.keys()].sort((a, b) => a - b)) {
    const own = byIssue.get(issued)!;
    let first = Infinity;
    let last = -Infinity;
    for (const f of own) {
      latest.set(vintageKey(f.stationId, f.hourStart), f.tempC);
      first = Math.min(first, f.hourStart);
      last = Math.max(last, f.hourStart);
    }
    const covered = new Set(own.map((f) => f.hourStart));
    const path = new Float64Array(index(last) - index(first) + 1).fill(NaN);
    for (const h of covered) {
      const t = weightedTemperature(stationIds.map((id) => latest.get(vintageKey(id, h))), weights);
      if (t !== null) path[index(h) - index(first)] = t;
    }
    vintages.push({ issued: (issued - firstHourMs) / HOUR_MS, first: index(first), members: [path] });
  }

  const total = hours + horizon;
  const holidayDays = new Set<string>();
  const bridgeDays = new Set<string>();
  for (const d of rows.specialDays) {
    if (d.zones.length > 0 && !d.zones.includes(rows.zone)) continue;
    if (d.kind === 'public-holiday') holidayDays.add(d.day);
    else if (d.kind === 'bridge-day') bridgeDays.add(d.day);
  }
  const hourOfDay = new Uint8Array(total);
  const weekday = new Uint8Array(total);
  const holiday = new Uint8Array(total);
  const bridge = new Uint8Array(total);
  for (let i = 0; i < total; i++) {
    const local = DateTime.fromMillis(firstHourMs + i * HOUR_MS, { zone: rows.timeZone });
    const day = local.toISODate()!;
    hourOfDay[i] = local.hour;
    weekday[i] = local.weekday % 7; // luxon: Monday 1 … Sunday 7; the engine: Sunday 0
    holiday[i] = holidayDays.has(day) ? 1 : 0;
    bridge[i] = bridgeDays.has(day) ? 1 : 0;
  }
  return { temperature, vintages, calendar: { hourOfDay, weekday, holiday, bridge }, observedHours };
}
