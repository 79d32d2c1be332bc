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
  | 'malformed';

export interface ReadingBatchAck {
  batchId: string;
  stored: number;
  rejected: { index: number; reason: RejectionReason; message: string }[];
}
