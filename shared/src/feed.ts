/**
 * The meter-feed wire protocol (socket.io). A feed connects to FEED_NAMESPACE with
 * `auth: { apiKey }` and emits READINGS_EVENT with a batch, acknowledged by a ReadingBatchAck.
 *
 * Ordering rule (the last word is the last word): every reading carries a `version`, the time
 * the feed produced that value in microseconds since 1970-01-01T00:00Z, strictly increasing
 * within one feed (a hybrid logical clock: max(clock, previous + 1); Kulkarni et al., 2014).
 * The store keeps, for each (zone, hour), the value with the highest version, whatever order
 * batches arrive, are retried or are processed in; every other value is kept as a revision.
 * A resend of the same value with the same version changes nothing. Readings without a version
 * (CSV uploads, and feeds that leave it out) are the latest value at the moment the server
 * stores them: they take max(server clock, stored version + 1). Batches on one socket are
 * processed in the order they arrive, each in one transaction: the ack either reports every
 * valid reading stored, or carries `error` and nothing of the batch was stored.
 */
export const FEED_NAMESPACE = '/feeds';
export const READINGS_EVENT = 'readings';

/** Quality flag a feed may attach: 'estimated' for a meter's own fill, 'suspect' for doubtful. */
export type ReadingQuality = 'good' | 'estimated' | 'suspect';

export interface FeedReading {
  /** Zone code, e.g. "MILLRACE". */
  zone: string;
  /** Start of the hour: ISO 8601 with offset or Z, on the hour. */
  hour: string;
  mw: number;
  quality?: ReadingQuality;
  /**
   * When the feed produced this value: microseconds since the epoch, a whole number between
   * MIN_READING_VERSION and the server's clock plus MAX_VERSION_AHEAD_US (outside it the reading
   * is rejected as 'malformed'). The highest version of a (zone, hour) is the stored value.
   * Leave it out only if arrival order is the order you mean.
   */
  version?: number;
}

/**
 * A source of versions: microseconds since the epoch from the wall clock, never equal to or below
 * the previous one it gave (a hybrid logical clock; Kulkarni, Demirbas et al., 2014), so values
 * produced one after another in one process are ordered even within one millisecond or when the
 * wall clock steps back.
 */
export class VersionClock {
  private last = 0;

  constructor(private readonly wallMs: () => number = Date.now) {}

  next(): number {
    this.last = Math.max(Math.floor(this.wallMs() * 1000), this.last + 1);
    return this.last;
  }

  /** The next version that is also above `floor` (a stored value's version). */
  nextAbove(floor: number): number {
    this.last = Math.max(this.last, floor);
    return this.next();
  }
}

/** Versions before 2000-01-01T00:00Z are refused: a version is a time in microseconds, not a counter. */
export const MIN_READING_VERSION = 946_684_800_000_000;
/** How far a version may run ahead of the server's clock (clock skew, logical-clock drift): one day. */
export const MAX_VERSION_AHEAD_US = 86_400_000_000;

export interface ReadingBatch {
  /** The feed's own id for this batch, echoed in the ack so it can drop it from its resend queue. */
  batchId: string;
  readings: FeedReading[];
}

export type RejectionReason =
  | 'unknown-zone'
  | 'not-on-the-hour'
  | 'not-a-number'
  | 'negative'
  | 'implausible'
  | 'too-far-in-future'
  | 'malformed'
  /** The feed's key is limited to one zone and the reading is for another. */
  | 'zone-not-allowed';

/** Most readings one batch may carry; a larger batch is refused whole with an error ack (errorCode 'too-large'). */
export const MAX_READINGS_PER_BATCH = 5000;

/**
 * Largest socket message the server reads, in bytes (socket.io's maxHttpBufferSize, the WebSocket
 * maxPayload). 5,000 readings of any valid form fit in well under a tenth of it, so a batch too big
 * in readings is answered with an error ack; a message over this size is closed by the transport
 * (WebSocket close code 1009) before it can be read, so a feed must check the size before sending
 * (the project's sender splits such a batch).
 */
export const MAX_BATCH_BYTES = 8_000_000;

/** Why a batch failed as a whole. 'server-error' is worth resending later; the others are not, as they are. */
export type BatchErrorCode = 'too-large' | 'malformed-batch' | 'revoked' | 'server-error';

export interface ReadingRejection {
  /** Position of the reading in the batch (or, for a CSV upload, see CsvRowRejection). */
  index: number;
  reason: RejectionReason;
  message: string;
}

export interface ReadingBatchAck {
  batchId: string;
  /**
   * Readings accepted and committed in this batch's one transaction (a repeat of a stored value,
   * and a value older than the stored one, kept as a revision, count as stored).
   */
  stored: number;
  /** Of the stored, how many were older than the value already stored (kept as revisions only). */
  superseded?: number;
  rejected: ReadingRejection[];
  /** Set when the whole batch failed; nothing of it was stored. See errorCode. */
  error?: string;
  errorCode?: BatchErrorCode;
}

/** A meter-feed API key as admins see it; the key itself is shown once, at creation. */
export interface FeedKeyDto {
  id: number;
  name: string;
  /** First characters of the key, to tell keys apart. */
  prefix: string;
  /** Zone code the key may send readings for; null for any zone. */
  zone: string | null;
  /** Weather station the key may send weather for (and nothing else); null when not limited to one. */
  station: string | null;
  createdAt: string;
  createdBy: string | null;
  lastUsedAt: string | null;
  revokedAt: string | null;
}

export interface CreateFeedKeyRequest {
  name: string;
  zone?: string | null;
  /** Limit the key to one weather station's observations and forecasts (not with zone). */
  station?: string | null;
}

export interface CreatedFeedKey {
  feedKey: FeedKeyDto;
  /** The secret; shown this once, stored only as a hash. */
  apiKey: string;
}
