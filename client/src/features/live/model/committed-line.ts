import type { CommittedBasis, CommittedDayDto, ZoneCommittedDto } from '@morrowline/shared';
import { hourIndex } from './hours';

/** A zone's basis, or for the system total 'mixed' where zones committed on different bases. */
export type LineBasis = CommittedBasis | 'mixed';

/** What was committed, laid out on the hours of a readings series (null where nothing was). */
export interface CommittedLine {
  schedule: (number | null)[];
  dayAhead: (number | null)[];
  committed: (number | null)[];
  basis: (LineBasis | null)[];
  /** Per operating day, where the numbers came from (none for the system total). */
  days: CommittedDayDto[];
}

export function emptyCommittedLine(length: number): CommittedLine {
  const empty = () => new Array<number | null>(length).fill(null);
  return { schedule: empty(), dayAhead: empty(), committed: empty(), basis: new Array<LineBasis | null>(length).fill(null), days: [] };
}

/** The server's committed numbers (on `committedHours`) moved onto a series starting at `fromMs`. */
export function committedOnSeries(zone: ZoneCommittedDto, committedHours: readonly string[], fromMs: number, length: number): CommittedLine {
  const line = emptyCommittedLine(length);
  committedHours.forEach((hour, k) => {
    const i = hourIndex(hour, fromMs, length);
    if (i < 0) return;
    line.schedule[i] = zone.schedule[k];
    line.dayAhead[i] = zone.dayAhead[k];
    line.committed[i] = zone.committed[k];
    line.basis[i] = zone.basis[k];
  });
  line.days = zone.days;
  return line;
}

/**
 * The system's committed line: per hour the sum over the zones, only where every zone has a
 * value (a sum over part of the system would look like a drop). Its basis is the zones' common
 * one, or 'mixed'; the schedule and day-ahead lines likewise need every zone.
 */
export function systemCommitted(lines: readonly CommittedLine[], length: number): CommittedLine {
  const out = emptyCommittedLine(length);
  if (lines.length === 0) return out;
  const sum = (pick: (l: CommittedLine) => (number | null)[], i: number): number | null => {
    let total = 0;
    for (const line of lines) {
      const v = pick(line)[i];
      if (v === null || v === undefined) return null;
      total += v;
    }
    return total;
  };
  for (let i = 0; i < length; i++) {
    out.schedule[i] = sum((l) => l.schedule, i);
    out.dayAhead[i] = sum((l) => l.dayAhead, i);
    out.committed[i] = sum((l) => l.committed, i);
    if (out.committed[i] === null) continue;
    const bases = new Set(lines.map((l) => l.basis[i]));
    out.basis[i] = bases.size === 1 ? (lines[0].basis[i] as LineBasis) : 'mixed';
  }
  return out;
}
