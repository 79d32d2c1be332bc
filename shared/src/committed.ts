/**
 * What the desk committed to for an hour: the published schedule where one is in force, otherwise
 * the day-ahead model forecast issued at or before the zone's gate closure for that operating day.
 * Deviation (on the zone cards and in the alerts) is measured against it; the latest intraday run
 * is a separate line and never stands in for it, nor does last week's load.
 */
export type CommittedBasis = 'schedule' | 'day-ahead';

/** Where a zone's committed numbers for one operating day came from. */
export interface CommittedDayDto {
  /** yyyy-MM-dd in the zone's time zone. */
  operatingDay: string;
  gateClosureAt: string;
  /** The published revision in force, if any. */
  schedule: { revisionId: number; revision: number; publishedAt: string } | null;
  /** The day-ahead run: the newest issued before gate closure that covers the whole day. */
  dayAhead: { runId: number; issuedAt: string; replayed: boolean } | null;
}

export interface ZoneCommittedDto {
  zone: string;
  /** On the response's hours: the published schedule's MW (null where none is in force). */
  schedule: (number | null)[];
  /** The day-ahead forecast's MW (null where no run was issued by gate closure). */
  dayAhead: (number | null)[];
  /** The schedule where there is one, else the day-ahead forecast; what deviation is measured against. */
  committed: (number | null)[];
  basis: (CommittedBasis | null)[];
  days: CommittedDayDto[];
}

/** GET /api/live/committed: per zone, on the hours [from, to). */
export interface CommittedLoadDto {
  from: string;
  to: string;
  hours: string[];
  zones: ZoneCommittedDto[];
}

/** The longest range the committed numbers are served for at once, in hours. */
export const COMMITTED_MAX_HOURS = 24 * 14;

/** The basis in words, for cards, alerts and captions. */
export function committedBasisLabel(basis: CommittedBasis | 'mixed' | null): string {
  if (basis === 'schedule') return 'published schedule';
  if (basis === 'day-ahead') return 'day-ahead forecast';
  if (basis === 'mixed') return 'schedules and day-ahead forecasts';
  return 'nothing committed';
}
