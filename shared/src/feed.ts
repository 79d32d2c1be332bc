/**
 * The meter-feed wire protocol (socket.io). A feed connects to FEED_NAMESPACE with
 * `auth: { apiKey }` and emits READINGS_EVENT with a batch, acknowledged by a ReadingBatchAck.
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
}

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

/** Most readings one batch may carry; a larger batch is refused whole (every reading 'malformed'). */
export const MAX_READINGS_PER_BATCH = 5000;

export interface ReadingRejection {
  /** Position of the reading in the batch (or, for a CSV upload, see CsvRowRejection). */
  index: number;
  reason: RejectionReason;
  message: string;
}

export interface ReadingBatchAck {
  batchId: string;
  /** Readings accepted and committed (a repeat of a stored value counts as stored). */
  stored: number;
  rejected: ReadingRejection[];
  /** Set when the whole batch failed (server trouble); resend it later. Nothing was stored. */
  error?: string;
}

/** A meter-feed API key as admins see it; the key itself is shown once, at creation. */
export interface FeedKeyDto {
  id: number;
  name: string;
  /** First characters of the key, to tell keys apart. */
  prefix: string;
  /** Zone code the key may send for; null for any zone. */
  zone: string | null;
  createdAt: string;
  createdBy: string | null;
  lastUsedAt: string | null;
  revokedAt: string | null;
}

export interface CreateFeedKeyRequest {
  name: string;
  zone?: string | null;
}

export interface CreatedFeedKey {
  feedKey: FeedKeyDto;
  /** The secret; shown this once, stored only as a hash. */
  apiKey: string;
}
