import type { ReadingQuality, RejectionReason } from './feed';

/** GET /api/readings: an hourly series per zone, null where no reading is stored. */
export interface ReadingSeriesDto {
  /** First hour start (UTC, inclusive) and end (exclusive). */
  from: string;
  to: string;
  /** UTC hour starts, one per element of every zone's `mw`. */
  hours: string[];
  zones: ZoneReadingsDto[];
}

export interface ZoneReadingsDto {
  zone: string;
  mw: (number | null)[];
  /** Quality per hour, null where missing. */
  quality: (ReadingQuality | null)[];
  /** Latest stored hour for the zone (any time, not only in range) and when it arrived. */
  lastHour: string | null;
  lastReceivedAt: string | null;
}

/** GET /api/readings/status: is each zone's feed keeping up? */
export interface FeedStatusDto {
  zone: string;
  lastHour: string | null;
  lastReceivedAt: string | null;
  /** Whole hours since the latest stored hour ended. */
  hoursBehind: number | null;
  /** No reading for more than STALE_AFTER_HOURS past the hourly cadence (or never a reading). */
  stale: boolean;
}

export const STALE_AFTER_HOURS = 2;

/** Why a CSV row was refused: a feed's reasons, or 'duplicate' for an hour that one file gives twice. */
/** A file's own reasons: an hour given twice, a row with no load at all (told apart from a load that is not a number). */
export type CsvRejectionReason = RejectionReason | 'duplicate' | 'empty-load';

/** A CSV row refused by an upload, with its line in the file (1 = first line). */
export interface CsvRowRejection {
  line: number;
  reason: CsvRejectionReason;
  message: string;
}

/** POST /api/readings/upload answers this. */
export interface CsvUploadReport {
  fileName: string;
  rows: number;
  /** Hours stored: each row accepted is one zone and hour (a file may not give an hour twice). */
  accepted: number;
  /** Of the accepted, how many replaced an earlier different value (a revision was kept). */
  revised: number;
  rejected: CsvRowRejection[];
  /** Only the first rejections are listed when there are many; this is the full count. */
  rejectedCount: number;
}

export const CSV_MAX_BYTES = 20 * 1024 * 1024;
