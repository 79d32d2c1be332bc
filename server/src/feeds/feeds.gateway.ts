import { type BeforeApplicationShutdown, Logger } from '@nestjs/common';
import { type OnGatewayConnection, WebSocketGateway, WebSocketServer } from '@nestjs/websockets';
import {
  FEED_NAMESPACE,
  MAX_BATCH_BYTES,
  MAX_READINGS_PER_BATCH,
  MAX_WEATHER_PER_BATCH,
  READINGS_EVENT,
  WEATHER_EVENT,
  type ReadingBatchAck,
  type WeatherBatchAck,
} from '@morrowline/shared';
import type { Namespace, Socket } from 'socket.io';
import { ReadingsService, type IngestResult } from '../readings/readings.service';
import { WeatherService } from '../weather/weather.service';
import { FeedKeysService, type FeedIdentity } from './feed-keys.service';

type Ack = (ack: ReadingBatchAck) => void;

/**
 * The meter feeds' channel. A feed connects with `auth: { apiKey }` (checked before the
 * connection is accepted) and emits READINGS_EVENT batches with an ack callback; the ack tells
 * it what was stored, so it can drop the batch from its resend queue.
 *
 * Batches of one socket are handled strictly one after another, in arrival order: each joins the
 * socket's chain synchronously when it arrives, before any await, and is checked and put in the
 * store's queue before the next one is looked at; the store applies them in that order, each
 * whole or not at all (see ReadingsRepository.store), and the ack follows the commit. On shutdown the chains are drained before the
 * database closes, so a batch in hand is either stored and acknowledged or answered with an error.
 */
@WebSocketGateway({ namespace: FEED_NAMESPACE, cors: { origin: false }, maxHttpBufferSize: MAX_BATCH_BYTES })
export class FeedsGateway implements OnGatewayConnection, BeforeApplicationShutdown {
  private readonly logger = new Logger(FeedsGateway.name);
  /** Each connected socket's chain of batches (its tail). */
  private readonly chains = new Map<string, Promise<void>>();
  /** Batches queued for the store whose acks are still to be sent. */
  private readonly writing = new Set<Promise<void>>();
  private closing = false;

  @WebSocketServer()
  server!: Namespace;

  constructor(
    private readonly keys: FeedKeysService,
    private readonly readings: ReadingsService,
    private readonly weather: WeatherService,
  ) {}

  afterInit(namespace: Namespace): void {
    namespace.use((socket, next) => {
      this.keys
        .authenticate((socket.handshake.auth as { apiKey?: unknown }).apiKey)
        .then((feed) => {
          (socket.data as { feed: FeedIdentity }).feed = feed;
          next();
        })
        .catch((error: Error) => next(new Error(error.message)));
    });
  }

  handleConnection(socket: Socket): void {
    const feed = (socket.data as { feed: FeedIdentity }).feed;
    this.logger.debug(`feed connected: ${feed.name}`);
    // Registered here rather than with @SubscribeMessage so the ack can be answered even for a
    // payload that is not an object at all.
    socket.on(READINGS_EVENT, (batch: unknown, ack: unknown) => {
      const answer = typeof ack === 'function' ? (ack as Ack) : () => undefined;
      const tail = (this.chains.get(socket.id) ?? Promise.resolve()).then(() => this.onBatch(socket, feed, batch, answer));
      this.chains.set(socket.id, tail);
    });
    // Weather batches join the same chain: one socket's batches of either kind are handled in arrival order.
    socket.on(WEATHER_EVENT, (batch: unknown, ack: unknown) => {
      const answer = typeof ack === 'function' ? (ack as (ack: WeatherBatchAck) => void) : () => undefined;
      const tail = (this.chains.get(socket.id) ?? Promise.resolve()).then(() => this.onWeather(socket, feed, batch, answer));
      this.chains.set(socket.id, tail);
    });
    socket.on('disconnect', () => {
      const tail = this.chains.get(socket.id);
      // Forget the chain once it has run out, unless more was queued meanwhile.
      void tail?.then(() => this.chains.get(socket.id) === tail && this.chains.delete(socket.id));
    });
  }

  /** Lets every batch in hand finish (stored and acknowledged) before the database is closed. */
  async beforeApplicationShutdown(): Promise<void> {
    this.closing = true;
    await Promise.all([...this.chains.values()]);
    await Promise.all([...this.writing]);
  }

  /** Never rejects: every path answers the ack. */
  private async onBatch(socket: Socket, feed: FeedIdentity, batch: unknown, ack: Ack): Promise<void> {
    const batchId = typeof (batch as { batchId?: unknown })?.batchId === 'string' ? (batch as { batchId: string }).batchId : '';
    const readings = (batch as { readings?: unknown })?.readings;
    if (!Array.isArray(readings)) {
      ack({ batchId, stored: 0, rejected: [], error: 'A batch must be { batchId, readings: [...] }', errorCode: 'malformed-batch' });
      return;
    }
    if (readings.length > MAX_READINGS_PER_BATCH) {
      ack({
        batchId,
        stored: 0,
        rejected: [],
        error: `A batch may carry at most ${MAX_READINGS_PER_BATCH} readings (and ${MAX_BATCH_BYTES} bytes); this one has ${readings.length}. Split it; nothing was stored`,
        errorCode: 'too-large',
      });
      return;
    }
    if (this.closing) {
      ack({ batchId, stored: 0, rejected: [], error: 'The server is shutting down; nothing was stored, send it again later', errorCode: 'server-error' });
      return;
    }
    if (feed.station) {
      const message = `This feed key may only send weather for ${feed.station}`;
      ack({ batchId, stored: 0, rejected: readings.map((_, index) => ({ index, reason: 'zone-not-allowed' as const, message })) });
      return;
    }
    let queued: { result: Promise<IngestResult> };
    try {
      if (!(await this.keys.isActive(feed.id))) {
        ack({ batchId, stored: 0, rejected: [], error: 'This feed key has been revoked', errorCode: 'revoked' });
        socket.disconnect(true);
        return;
      }
      queued = await this.readings.enqueue(readings, { source: `feed:${feed.name}`, allowedZone: feed.zone });
    } catch (error) {
      this.failed(batchId, feed, error, ack);
      return;
    }
    // Queued in arrival order: the socket's next batch may be validated while this one is written.
    const written = queued.result.then(
      (result) => ack({ batchId, stored: result.stored, superseded: result.superseded, rejected: result.rejected }),
      (error: unknown) => this.failed(batchId, feed, error, ack),
    );
    this.writing.add(written);
    void written.finally(() => this.writing.delete(written));
  }

  /**
   * A weather batch: observations and forecast values checked like readings and stored in one
   * transaction; the ack follows the commit, and the socket's next batch waits for it. Never rejects.
   */
  private async onWeather(socket: Socket, feed: FeedIdentity, batch: unknown, ack: (ack: WeatherBatchAck) => void): Promise<void> {
    const body = typeof batch === 'object' && batch !== null ? (batch as { batchId?: unknown; observations?: unknown; forecasts?: unknown }) : {};
    const batchId = typeof body.batchId === 'string' ? body.batchId : '';
    const observations = body.observations ?? [];
    const forecasts = body.forecasts ?? [];
    if (typeof batch !== 'object' || batch === null || !Array.isArray(observations) || !Array.isArray(forecasts)) {
      ack({ batchId, stored: 0, rejected: [], error: 'A weather batch must be { batchId, observations?: [...], forecasts?: [...] }', errorCode: 'malformed-batch' });
      return;
    }
    if (observations.length + forecasts.length > MAX_WEATHER_PER_BATCH) {
      ack({ batchId, stored: 0, rejected: [], error: `A weather batch may carry at most ${MAX_WEATHER_PER_BATCH} values; this one has ${observations.length + forecasts.length}. Split it; nothing was stored`, errorCode: 'too-large' });
      return;
    }
    if (this.closing) {
      ack({ batchId, stored: 0, rejected: [], error: 'The server is shutting down; nothing was stored, send it again later', errorCode: 'server-error' });
      return;
    }
    if (feed.zone) {
      const message = `This feed key may only send readings for ${feed.zone}`;
      const refuse = (list: 'observations' | 'forecasts', n: number) => Array.from({ length: n }, (_, index) => ({ list, index, reason: 'station-not-allowed' as const, message }));
      ack({ batchId, stored: 0, rejected: [...refuse('observations', observations.length), ...refuse('forecasts', forecasts.length)] });
      return;
    }
    const written = (async () => {
      try {
        if (!(await this.keys.isActive(feed.id))) {
          ack({ batchId, stored: 0, rejected: [], error: 'This feed key has been revoked', errorCode: 'revoked' });
          socket.disconnect(true);
          return;
        }
        const result = await this.weather.ingestBatch(observations, forecasts, { source: `feed:${feed.name}`, allowedStation: feed.station });
        ack({ batchId, stored: result.stored, rejected: result.rejected });
      } catch (error) {
        this.logger.error(`weather batch ${batchId} from ${feed.name} failed: ${(error as Error).stack ?? String(error)}`);
        ack({ batchId, stored: 0, rejected: [], error: 'The server could not store this batch; nothing of it was stored, send it again later', errorCode: 'server-error' });
      }
    })();
    this.writing.add(written);
    await written;
    this.writing.delete(written);
  }

  private failed(batchId: string, feed: FeedIdentity, error: unknown, ack: Ack): void {
    this.logger.error(`batch ${batchId} from ${feed.name} failed: ${(error as Error).stack ?? String(error)}`);
    ack({ batchId, stored: 0, rejected: [], error: 'The server could not store this batch; nothing of it was stored, send it again later', errorCode: 'server-error' });
  }
}
