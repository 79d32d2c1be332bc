import type { Redis } from 'ioredis';
import type { ClusterConfig } from './cluster-config';

/**
 * A Redis connection for the cluster. ioredis is loaded here, on first use, so a single machine
 * (no REDIS_URL) never loads it, let alone connects. `maxRetriesPerRequest: null` is what BullMQ
 * requires of a worker's connection (a command waits out a Redis restart instead of failing the job).
 * A producer's connection (the queue jobs are added to) fails fast instead.
 */
export async function openRedis(config: ClusterConfig, purpose: string, { failFast = false } = {}): Promise<Redis> {
  const { Redis: RedisClient } = await import('ioredis');
  return new RedisClient(config.redisUrl, {
    connectionName: `morrowline-${config.role}-${purpose}-${process.pid}`,
    // A producer fails at once while Redis is away (the request answers a job that could not be
    // queued) rather than holding an HTTP request open until Redis returns; BullMQ's advice for queues.
    ...(failFast ? { enableOfflineQueue: false, maxRetriesPerRequest: 1 } : { maxRetriesPerRequest: null }),
  });
}
