import { HOUR_MS } from '@morrowline/shared';

/** Hours each fit trains on: eight weeks, as the engine's backtest window. */
export const TRAINING_HOURS = 8 * 168;

export interface ZoneHistory {
  firstHourMs: number;
  lastHourMs: number;
  /** MW, NaN for missing and for excluded hours */
  values: Float64Array;
  /** indices of outage / bad-data hours, ascending */
  excluded: number[];
  usable: number;
}

export interface HourlyReading {
  hourStart: number;
  mw: number;
}

/**
 * The one rule for a fit's window: `hours` hours ending with the hour that starts at `lastHourMs`,
 * the readings placed by hour, the outage and bad-data hours inside the window marked and taken
 * out (NaN), and the hours left that a fit can use counted. Readings and exclusions outside the
 * window are ignored. The live loader and the demo replay both build their windows here.
 */
export function zoneHistoryWindow(lastHourMs: number, hours: number, readings: Iterable<HourlyReading>, excludedHours: Iterable<number>): ZoneHistory {
  const firstHourMs = lastHourMs - (hours - 1) * HOUR_MS;
  const values = new Float64Array(hours).fill(NaN);
  for (const r of readings) {
    if (r.hourStart < firstHourMs || r.hourStart > lastHourMs) continue;
    values[(r.hourStart - firstHourMs) / HOUR_MS] = r.mw;
  }
  const excluded: number[] = [];
  for (const h of excludedHours) {
    if (h < firstHourMs || h > lastHourMs) continue;
    const i = (h - firstHourMs) / HOUR_MS;
    excluded.push(i);
    values[i] = NaN;
  }
  excluded.sort((a, b) => a - b);
  let usable = 0;
  for (const v of values) if (v === v) usable++;
  return { firstHourMs, lastHourMs, values, excluded, usable };
}
