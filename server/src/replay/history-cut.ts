import { HOUR_MS } from '@morrowline/shared';
import { TRAINING_HOURS, zoneHistoryWindow, type HourlyReading, type ZoneHistory } from '../history/zone-history';

export type { HourlyReading };

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
    return zoneHistoryWindow(lastHourMs, hours, this.readingsBefore(end, lastHourMs - (hours - 1) * HOUR_MS), this.excluded);
  }

  /** The readings at indices below `end` whose hour starts at or after `firstHourMs`, newest first. */
  private *readingsBefore(end: number, firstHourMs: number): Generator<HourlyReading> {
    for (let i = end - 1; i >= 0 && this.hours[i] >= firstHourMs; i--) yield { hourStart: this.hours[i], mw: this.mw[i] };
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
