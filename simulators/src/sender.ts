import { io, type Socket } from 'socket.io-client';
import {
  FEED_NAMESPACE,
  MAX_BATCH_BYTES,
  MAX_READINGS_PER_BATCH,
  READINGS_EVENT,
  VersionClock,
  WEATHER_EVENT,
  type WeatherBatchAck,
  type FeedReading,
  type ReadingBatch,
  type ReadingBatchAck,
} from '@morrowline/shared';
import type { SimReading, SimWeather } from './generator';

/** Weather values per batch: well under the server's MAX_WEATHER_PER_BATCH and its message size. */
const WEATHER_BATCH_VALUES = 5000;
/** How long to wait for a weather ack before sending the batch again (a resend is harmless, see sendWeather). */
const WEATHER_ACK_TIMEOUT_MS = 30_000;

export interface SenderStats {
  sent: number;
  stored: number;
  rejected: number;
  resent: number;
  /** Stored, but older than the value the server already had (kept there as a revision). */
  superseded: number;
  /** Readings given up: a single reading too large to send, or a batch the server called malformed. */
  dropped: number;
}

export interface SenderOptions {
  /** Batches sent and not yet acknowledged at once. */
  maxInFlight?: number;
  /** Wait before resending after an ack saying the server could not store a batch. */
  retryDelayMs?: number;
  /** The server's limits (the wire contract's by default). */
  maxReadings?: number;
  maxBytes?: number;
  /** Told of every batch the server acknowledged as stored. */
  onStored?: (batch: ReadingBatch, ack: ReadingBatchAck) => void;
  /** Socket reconnection delays (tests make them short). */
  reconnectionDelay?: number;
  reconnectionDelayMax?: number;
}

interface Queued {
  batch: ReadingBatch;
  /** Which emit of this batch an ack must belong to; 0 while not in flight. */
  attempt: number;
  sends: number;
}

/** Room left for socket.io's framing around the JSON of a batch. */
const FRAME_BYTES = 64;

/**
 * Sends batches over the feed socket and keeps every batch until the server acknowledges it.
 *
 * Order: every reading is stamped with a version from a hybrid logical clock when it is queued
 * (see FeedReading.version), so the server keeps the value queued last for each hour whatever
 * happens in between. Batches wait in one queue in the order they were made and are sent from
 * its head: after a disconnect or an ack saying the server could not store a batch, sending
 * pauses and starts again from the oldest unacknowledged batch, so no batch is sent for the first
 * time ahead of an older one still waiting. (Batches already in flight when an older one failed
 * may be stored before its retry; their higher versions keep them.)
 *
 * Size: a batch is split before sending so it stays within MAX_READINGS_PER_BATCH and
 * MAX_BATCH_BYTES; a 'too-large' ack splits it in two; a single reading too large to send is
 * dropped with a log line. Nothing is ever resent unchanged after being refused as too large.
 */
export class FeedSender {
  private readonly socket: Socket;
  private readonly queue: Queued[] = [];
  private readonly clock = new VersionClock();
  private readonly maxInFlight: number;
  private readonly retryDelayMs: number;
  private readonly maxReadings: number;
  private readonly maxBytes: number;
  private serial = 0;
  private attempts = 0;
  private pausedUntil = 0;
  private resumeTimer: NodeJS.Timeout | null = null;
  private waiters: (() => void)[] = [];
  readonly stats: SenderStats = { sent: 0, stored: 0, rejected: 0, resent: 0, superseded: 0, dropped: 0 };
  readonly weatherStats = { sent: 0, stored: 0, rejected: 0 };
  private fatal: Error | null = null;
  private readonly onStored?: (batch: ReadingBatch, ack: ReadingBatchAck) => void;

  constructor(
    url: string,
    apiKey: string,
    private readonly runId: string,
    private readonly log: (line: string) => void,
    maxInFlightOrOptions: number | SenderOptions = 4,
  ) {
    const options: SenderOptions = typeof maxInFlightOrOptions === 'number' ? { maxInFlight: maxInFlightOrOptions } : maxInFlightOrOptions;
    this.maxInFlight = options.maxInFlight ?? 4;
    this.retryDelayMs = options.retryDelayMs ?? 2000;
    this.maxReadings = options.maxReadings ?? MAX_READINGS_PER_BATCH;
    this.maxBytes = options.maxBytes ?? MAX_BATCH_BYTES;
    this.onStored = options.onStored;
    this.socket = io(`${url.replace(/\/$/, '')}${FEED_NAMESPACE}`, {
      auth: { apiKey },
      transports: ['websocket'],
      reconnectionDelay: options.reconnectionDelay ?? 1000,
      reconnectionDelayMax: options.reconnectionDelayMax ?? 5000,
    });
    this.socket.on('connect', () => {
      const waiting = this.queue.filter((q) => q.sends > 0).length;
      this.log(`connected to ${url}${waiting ? `; resending ${waiting} unacknowledged batch(es) in order` : ''}`);
      this.pump();
    });
    this.socket.on('disconnect', (reason, details) => {
      const inFlight = this.queue.filter((q) => q.attempt !== 0);
      for (const q of this.queue) q.attempt = 0;
      // 1009: a message was over the server's size limit. Which one cannot be told, so every batch
      // that was in flight is halved (a single reading is given up): this cannot loop.
      if ((details as { context?: { code?: number } } | undefined)?.context?.code === 1009) {
        this.log('the server closed the socket: a batch was over its size limit; splitting the batches in flight');
        for (const q of inFlight) this.split(q, 'over the server size limit');
      }
      this.log(`disconnected (${reason}); will resend what is not acknowledged`);
    });
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
    return this.queue.length;
  }

  /**
   * Stamps the readings with versions and queues them as one batch or more (split to the
   * limits); waits while too many batches are unacknowledged.
   */
  async send(readings: SimReading[]): Promise<void> {
    if (readings.length === 0) return;
    if (this.fatal) throw this.fatal;
    while (this.queue.length >= this.maxInFlight) await this.waitForChange();
    const stamped: FeedReading[] = readings.map((r) => ({ ...r, version: this.clock.next() }));
    this.stats.sent += stamped.length;
    for (const part of this.fit(stamped)) this.queue.push({ batch: { batchId: this.nextId(), readings: part }, attempt: 0, sends: 0 });
    this.pump();
  }

  /**
   * Sends weather over the same socket, one batch at a time, each until the server acknowledges it.
   * A resend is harmless: observations carry versions (the server keeps the highest), and a
   * forecast value sent again with the same temperature is a repeat of its vintage.
   */
  async sendWeather(weather: SimWeather): Promise<void> {
    const observations = weather.observations.map((o) => ({ ...o, version: this.clock.next() }));
    const forecasts = weather.forecasts;
    for (let i = 0; i < observations.length + forecasts.length; i += WEATHER_BATCH_VALUES) {
      const end = i + WEATHER_BATCH_VALUES;
      const batch = {
        batchId: this.nextId(),
        observations: observations.slice(Math.min(i, observations.length), Math.min(end, observations.length)),
        forecasts: forecasts.slice(Math.max(0, i - observations.length), Math.max(0, end - observations.length)),
      };
      this.weatherStats.sent += batch.observations.length + batch.forecasts.length;
      for (;;) {
        if (this.fatal) throw this.fatal;
        const ack = await new Promise<WeatherBatchAck | null>((resolve) => {
          this.socket.timeout(WEATHER_ACK_TIMEOUT_MS).emit(WEATHER_EVENT, batch, (error: Error | null, answer: WeatherBatchAck) => resolve(error ? null : answer));
        });
        if (ack && !ack.error) {
          this.weatherStats.stored += ack.stored;
          this.weatherStats.rejected += ack.rejected.length;
          if (ack.rejected.length > 0) this.log(`weather batch ${batch.batchId}: ${ack.rejected.length} rejected; first: ${ack.rejected[0].message}`);
          break;
        }
        if (ack?.errorCode === 'revoked' || ack?.errorCode === 'malformed-batch' || ack?.errorCode === 'too-large') {
          this.log(`weather batch ${batch.batchId} not stored: ${ack.error}`);
          if (ack.errorCode === 'revoked') throw new Error(ack.error);
          break;
        }
        await new Promise((resolve) => setTimeout(resolve, this.retryDelayMs));
      }
    }
  }

  /** Resolves once every batch is acknowledged. */
  async drain(): Promise<void> {
    while (this.queue.length > 0) await this.waitForChange();
  }

  close(): void {
    if (this.resumeTimer) clearTimeout(this.resumeTimer);
    this.socket.close();
  }

  private nextId(): string {
    return `${this.runId}-${++this.serial}`;
  }

  private bytes(readings: readonly FeedReading[]): number {
    return Buffer.byteLength(JSON.stringify({ batchId: `${this.runId}-${this.serial + 1}x`, readings })) + FRAME_BYTES;
  }

  /** Splits readings into batches within both limits, in order; drops a single reading too large to send. */
  private fit(readings: FeedReading[]): FeedReading[][] {
    if (readings.length > this.maxReadings) {
      const out: FeedReading[][] = [];
      for (let i = 0; i < readings.length; i += this.maxReadings) out.push(...this.fit(readings.slice(i, i + this.maxReadings)));
      return out;
    }
    if (this.bytes(readings) <= this.maxBytes) return [readings];
    if (readings.length === 1) {
      this.stats.dropped++;
      this.log(`dropped a reading for ${String(readings[0].zone).slice(0, 40)} ${String(readings[0].hour).slice(0, 40)}: larger than the server's ${this.maxBytes}-byte message limit by itself`);
      return [];
    }
    const half = Math.ceil(readings.length / 2);
    return [...this.fit(readings.slice(0, half)), ...this.fit(readings.slice(half))];
  }

  /** Replaces a queued batch by its halves, in place (so the order holds). */
  private split(q: Queued, why: string): void {
    const at = this.queue.indexOf(q);
    if (at < 0) return;
    const readings = q.batch.readings;
    if (readings.length <= 1) {
      this.queue.splice(at, 1);
      this.stats.dropped += readings.length;
      this.log(`dropped batch ${q.batch.batchId} (${readings.length} reading): ${why}`);
      this.wake();
      return;
    }
    const half = Math.ceil(readings.length / 2);
    const parts = [readings.slice(0, half), readings.slice(half)].map((part) => ({ batch: { batchId: this.nextId(), readings: part }, attempt: 0, sends: 0 }));
    this.queue.splice(at, 1, ...parts);
    this.log(`split batch ${q.batch.batchId} (${readings.length} readings) in two: ${why}`);
  }

  /** Sends, from the head of the queue, what is not in flight, up to maxInFlight. */
  private pump(): void {
    if (!this.socket.connected || this.fatal) return;
    const wait = this.pausedUntil - Date.now();
    if (wait > 0) {
      this.resumeTimer ??= setTimeout(() => {
        this.resumeTimer = null;
        this.pump();
      }, wait);
      return;
    }
    let inFlight = this.queue.filter((q) => q.attempt !== 0).length;
    for (const q of this.queue) {
      if (inFlight >= this.maxInFlight) break;
      if (q.attempt !== 0) continue;
      this.emit(q);
      inFlight++;
    }
  }

  private emit(q: Queued): void {
    const attempt = ++this.attempts;
    q.attempt = attempt;
    if (q.sends++ > 0) this.stats.resent++;
    this.socket.emit(READINGS_EVENT, q.batch, (ack: ReadingBatchAck) => this.onAck(q, attempt, ack));
  }

  private onAck(q: Queued, attempt: number, ack: ReadingBatchAck): void {
    // An answer to an emit before a reconnect, or to a batch already settled: not ours to act on.
    if (q.attempt !== attempt || !this.queue.includes(q)) return;
    q.attempt = 0;
    if (ack.error) {
      this.log(`batch ${q.batch.batchId} not stored: ${ack.error}`);
      if (ack.errorCode === 'revoked' || /revoked/.test(ack.error)) {
        this.fatal = new Error(ack.error);
        this.wake();
        return;
      }
      if (ack.errorCode === 'too-large') {
        this.split(q, 'the server refused it as too large');
      } else if (ack.errorCode === 'malformed-batch') {
        this.queue.splice(this.queue.indexOf(q), 1);
        this.stats.dropped += q.batch.readings.length;
        this.wake();
      } else {
        // Server trouble: pause, then start again from the oldest batch not acknowledged.
        this.pausedUntil = Date.now() + this.retryDelayMs;
      }
      this.pump();
      return;
    }
    this.queue.splice(this.queue.indexOf(q), 1);
    this.stats.stored += ack.stored;
    this.stats.superseded += ack.superseded ?? 0;
    this.stats.rejected += ack.rejected.length;
    if (ack.rejected.length > 0) {
      const reasons = new Map<string, number>();
      for (const r of ack.rejected) reasons.set(r.reason, (reasons.get(r.reason) ?? 0) + 1);
      this.log(`batch ${q.batch.batchId}: ${ack.rejected.length} rejected (${[...reasons].map(([k, v]) => `${k} ${v}`).join(', ')}); first: ${ack.rejected[0].message}`);
    }
    this.onStored?.(q.batch, ack);
    this.wake();
    this.pump();
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
