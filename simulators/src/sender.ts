import { io, type Socket } from 'socket.io-client';
import { FEED_NAMESPACE, READINGS_EVENT, type ReadingBatch, type ReadingBatchAck } from '@morrowline/shared';
import type { SimReading } from './generator';

export interface SenderStats {
  sent: number;
  stored: number;
  rejected: number;
  resent: number;
}

/**
 * Sends batches over the feed socket and keeps every batch until the server acknowledges it;
 * after a disconnect (or an ack saying the server could not store it) the batch is sent again.
 * Resending is safe: the server stores each (zone, hour) once.
 */
export class FeedSender {
  private readonly socket: Socket;
  private readonly unacked = new Map<string, ReadingBatch>();
  private readonly inFlight = new Set<string>();
  private serial = 0;
  private waiters: (() => void)[] = [];
  readonly stats: SenderStats = { sent: 0, stored: 0, rejected: 0, resent: 0 };
  private fatal: Error | null = null;

  constructor(
    url: string,
    apiKey: string,
    private readonly runId: string,
    private readonly log: (line: string) => void,
    private readonly maxInFlight = 4,
  ) {
    this.socket = io(`${url.replace(/\/$/, '')}${FEED_NAMESPACE}`, { auth: { apiKey }, transports: ['websocket'], reconnectionDelayMax: 5000 });
    this.socket.on('connect', () => {
      this.log(`connected to ${url}${this.unacked.size ? `; resending ${this.unacked.size} unacknowledged batch(es)` : ''}`);
      this.inFlight.clear();
      for (const batchId of this.unacked.keys()) {
        this.stats.resent++;
        this.emit(batchId);
      }
    });
    this.socket.on('disconnect', (reason) => this.log(`disconnected (${reason}); will resend what is not acknowledged`));
    this.socket.on('connect_error', (error) => {
      this.log(`cannot connect: ${error.message}`);
      if (/revoked|not known|apiKey/.test(error.message)) {
        this.fatal = new Error(`The server refused the feed key: ${error.message}`);
        this.socket.close();
        this.wake();
      }
    });
  }

  get pending(): number {
    return this.unacked.size;
  }

  /** Queues readings as one batch; waits while too many batches are unacknowledged. */
  async send(readings: SimReading[]): Promise<void> {
    if (readings.length === 0) return;
    while (this.unacked.size >= this.maxInFlight) await this.waitForChange();
    const batchId = `${this.runId}-${++this.serial}`;
    this.unacked.set(batchId, { batchId, readings });
    this.stats.sent += readings.length;
    if (this.socket.connected) this.emit(batchId);
  }

  /** Resolves once every batch is acknowledged. */
  async drain(): Promise<void> {
    while (this.unacked.size > 0) await this.waitForChange();
  }

  close(): void {
    this.socket.close();
  }

  private emit(batchId: string): void {
    const batch = this.unacked.get(batchId);
    if (!batch || this.inFlight.has(batchId)) return;
    this.inFlight.add(batchId);
    this.socket.emit(READINGS_EVENT, batch, (ack: ReadingBatchAck) => this.onAck(batchId, ack));
  }

  private onAck(batchId: string, ack: ReadingBatchAck): void {
    this.inFlight.delete(batchId);
    if (!this.unacked.has(batchId)) return;
    if (ack.error) {
      this.log(`batch ${batchId} not stored: ${ack.error}`);
      if (/revoked/.test(ack.error)) {
        this.fatal = new Error(ack.error);
        this.wake();
        return;
      }
      setTimeout(() => this.emit(batchId), 2000);
      return;
    }
    this.unacked.delete(batchId);
    this.stats.stored += ack.stored;
    this.stats.rejected += ack.rejected.length;
    if (ack.rejected.length > 0) {
      const reasons = new Map<string, number>();
      for (const r of ack.rejected) reasons.set(r.reason, (reasons.get(r.reason) ?? 0) + 1);
      this.log(`batch ${batchId}: ${ack.rejected.length} rejected (${[...reasons].map(([k, v]) => `${k} ${v}`).join(', ')}); first: ${ack.rejected[0].message}`);
    }
    this.wake();
  }

  private waitForChange(): Promise<void> {
    if (this.fatal) return Promise.reject(this.fatal);
    return new Promise((resolve, reject) => this.waiters.push(() => (this.fatal ? reject(this.fatal) : resolve())));
  }

  private wake(): void {
    const waiters = this.waiters;
    this.waiters = [];
    for (const w of waiters) w();
  }
}
