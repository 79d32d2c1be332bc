import { Logger } from '@nestjs/common';
import { type OnGatewayConnection, WebSocketGateway, WebSocketServer } from '@nestjs/websockets';
import { FEED_NAMESPACE, MAX_READINGS_PER_BATCH, READINGS_EVENT, type ReadingBatchAck } from '@morrowline/shared';
import type { Namespace, Socket } from 'socket.io';
import { ReadingsService } from '../readings/readings.service';
import { FeedKeysService, type FeedIdentity } from './feed-keys.service';

type Ack = (ack: ReadingBatchAck) => void;

/**
 * The meter feeds' channel. A feed connects with `auth: { apiKey }` (checked before the
 * connection is accepted) and emits READINGS_EVENT batches with an ack callback; the ack tells
 * it what was stored, so it can drop the batch from its resend queue.
 */
@WebSocketGateway({ namespace: FEED_NAMESPACE, cors: { origin: false }, maxHttpBufferSize: 8e6 })
export class FeedsGateway implements OnGatewayConnection {
  private readonly logger = new Logger(FeedsGateway.name);

  @WebSocketServer()
  server!: Namespace;

  constructor(
    private readonly keys: FeedKeysService,
    private readonly readings: ReadingsService,
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
      void this.onBatch(socket, feed, batch, typeof ack === 'function' ? (ack as Ack) : () => undefined);
    });
  }

  private async onBatch(socket: Socket, feed: FeedIdentity, batch: unknown, ack: Ack): Promise<void> {
    const batchId = typeof (batch as { batchId?: unknown })?.batchId === 'string' ? (batch as { batchId: string }).batchId : '';
    const readings = (batch as { readings?: unknown })?.readings;
    if (!Array.isArray(readings)) {
      ack({ batchId, stored: 0, rejected: [], error: 'A batch must be { batchId, readings: [...] }' });
      return;
    }
    if (readings.length > MAX_READINGS_PER_BATCH) {
      ack({
        batchId,
        stored: 0,
        rejected: readings.map((_, index) => ({ index, reason: 'malformed', message: `A batch may carry at most ${MAX_READINGS_PER_BATCH} readings` })),
      });
      return;
    }
    try {
      if (!(await this.keys.isActive(feed.id))) {
        ack({ batchId, stored: 0, rejected: [], error: 'This feed key has been revoked' });
        socket.disconnect(true);
        return;
      }
      const result = await this.readings.ingest(readings, { source: `feed:${feed.name}`, allowedZone: feed.zone });
      ack({ batchId, stored: result.stored, rejected: result.rejected });
    } catch (error) {
      this.logger.error(`batch ${batchId} from ${feed.name} failed: ${(error as Error).stack ?? String(error)}`);
      ack({ batchId, stored: 0, rejected: [], error: 'The server could not store this batch; send it again later' });
    }
  }
}
