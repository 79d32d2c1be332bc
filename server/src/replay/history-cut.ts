import { TRAINING_HOURS, type ZoneHistory } from '../history/zone-history.loader';

const HOUR_MS = 3_600_000;

export interface HourlyReading {
  hourStart: number;
  mw: number;
}

/**
 * Readings of a zone in time order, cut at any past moment: the history a fit would have had
 * then. A reading exists from the end of its hour (meters report an hour once it has ended), so
 * at time `t` the history holds the hours that ended by `t`, and nothing at or after `t` can reach
 * a replayed fit. The window and the exclusions are those of ZoneHistoryLoader, the live loader.
 */
export class ReadingsTimeline {
  private readonly hours: Float64Array;
  private readonly mw: Float64Array;

  /** `readings` sorted by hour; `excluded`: hour starts inside outage and bad-data windows. */
  constructor(
    readings: readonly HourlyReading[],
    private readonly excluded: ReadonlySet<number>,
  ) {
    this.hours = Float64Array.from(readings, (r) => r.hourStart);
    this.mw = Float64Array.from(readings, (r) => r.mw);
    for (let i = 1; i < this.hours.length; i++) if (!(this.hours[i] > this.hours[i - 1])) throw new Error('readings must be in time order, one per hour');
  }

  /** How many readings had arrived by `t` (the refit jobs' "enough history for a first model"). */
  countAt(t: number): number {
    return this.endAt(t);
  }

  /** The history a fit at `t` had: the last `hours` hours up to the latest reading then; null before the first. */
  historyAt(t: number, hours = TRAINING_HOURS): ZoneHistory | null {
    const end = this.endAt(t);
    if (end === 0) return null;
    const lastHourMs = this.hours[end - 1];
    const firstHourMs = lastHourMs - (hours - 1) * HOUR_MS;
    const values = new Float64Array(hours).fill(NaN);
    for (let i = end - 1; i >= 0 && this.hours[i] >= firstHourMs; i--) values[(this.hours[i] - firstHourMs) / HOUR_MS] = this.mw[i];
    const excluded: number[] = [];
    for (const h of this.excluded) {
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

  /** Index after the last reading whose hour ended by `t` (binary search). */
  private endAt(t: number): number {
    let lo = 0;
    let hi = this.hours.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (this.hours[mid] + HOUR_MS <= t) lo = mid + 1;
      else hi = mid;
    }
    return lo;
  }
}
