import type { INestApplicationContext } from '@nestjs/common';
import { MAX_BATCH_BYTES } from '@morrowline/shared';
import type { Redis } from 'ioredis';
import { Server, type ServerOptions } from 'socket.io';
import { FeedsIoAdapter } from '../feeds/feeds-io.adapter';
import type { ClusterConfig } from './cluster-config';
import { openRedis } from './redis-connection';

/**
 * How long a desk that lost its node may come back to another and be given what it missed
 * (socket.io's connection state recovery; the Redis Streams adapter keeps the messages in its
 * stream and the session in Redis). Longer than that, the desk refetches (client/src: the live
 * queries are fetched again on every reconnection).
 */
export const DESK_RECOVERY_MS = 2 * 60_000;

/**
 * Options shared by a node's socket.io server and a worker's relay: the Redis Streams adapter
 * (chosen over the pub/sub Redis adapter because it supports connection state recovery and a
 * node that loses Redis for a moment reads the stream on from where it was, rather than losing
 * what was published meanwhile), and recovery that still runs the namespace's token check.
 */
async function clusterServerOptions(config: ClusterConfig): Promise<Partial<ServerOptions>> {
  const { createAdapter } = await import('@socket.io/redis-streams-adapter');
  const redis: Redis = await openRedis(config, 'desk');
  return {
    adapter: createAdapter(redis, { streamName: 'morrowline:desk', sessionKeyPrefix: 'morrowline:desk-session:', onlyPlaintext: true }) as unknown as ServerOptions['adapter'],
    connectionStateRecovery: { maxDisconnectionDuration: DESK_RECOVERY_MS, skipMiddlewares: false },
  };
}

/** A node's socket.io server in cluster mode: the feeds' message limit plus the Redis adapter. */
export class ClusterIoAdapter extends FeedsIoAdapter {
  private constructor(
    app: INestApplicationContext,
    private readonly clusterOptions: Partial<ServerOptions>,
  ) {
    super(app);
  }

  static async create(app: INestApplicationContext, config: ClusterConfig): Promise<ClusterIoAdapter> {
    return new ClusterIoAdapter(app, await clusterServerOptions(config));
  }

  override createIOServer(port: number, options?: ServerOptions): Server {
    return super.createIOServer(port, { ...options, ...this.clusterOptions } as ServerOptions);
  }
}

/**
 * A worker's way to the desks: a socket.io server that listens on no port and only broadcasts
 * through the adapter, so the desk messages a worker's refits raise reach the desks on every node
 * (each node delivers them to its own sockets).
 */
export async function createDeskRelay(config: ClusterConfig): Promise<Server> {
  return new Server({ ...(await clusterServerOptions(config)), maxHttpBufferSize: MAX_BATCH_BYTES });
}
