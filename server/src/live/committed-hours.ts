import { HOUR_MS, type CommittedBasis, type OperatingDay } from '@morrowline/shared';
import type { DaySource } from '../accuracy/accuracy-report';

/** One operating day's committed sources, each with its values on the day's hours. */
export interface CommittedDay {
  day: OperatingDay;
  schedule: DaySource | null;
  dayAhead: DaySource | null;
}

export interface CommittedHours {
  schedule: (number | null)[];
  dayAhead: (number | null)[];
  committed: (number | null)[];
  basis: (CommittedBasis | null)[];
}

/**
 * Lays the days' schedule and day-ahead values onto the hours [from, from + count h). An hour's
 * committed value is the published schedule's where that has a value for the hour, otherwise the
 * day-ahead forecast's; where neither exists the hour has nothing committed (null), and no other
 * number (a later run, last week's load) is put in its place.
 */
export function layCommitted(from: number, count: number, days: readonly CommittedDay[]): CommittedHours {
  const empty = () => new Array<number | null>(count).fill(null);
  const out: CommittedHours = { schedule: empty(), dayAhead: empty(), committed: empty(), basis: new Array<CommittedBasis | null>(count).fill(null) };
  for (const { day, schedule, dayAhead } of days) {
    for (let h = 0; h < day.labels.length; h++) {
      const i = (day.start + h * HOUR_MS - from) / HOUR_MS;
      if (!Number.isInteger(i) || i < 0 || i >= count) continue;
      const s = schedule?.values[h] ?? null;
      const d = dayAhead?.values[h] ?? null;
      out.schedule[i] = s;
      out.dayAhead[i] = d;
      if (s !== null) {
        out.committed[i] = s;
        out.basis[i] = 'schedule';
      } else if (d !== null) {
        out.committed[i] = d;
        out.basis[i] = 'day-ahead';
      }
    }
  }
  return out;
}
