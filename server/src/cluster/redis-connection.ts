import type { Redis } from 'ioredis';
import type { ClusterConfig } from './cluster-config';

/**
 * A Redis connection for the cluster. ioredis is loaded here, on first use, so a single machine
 * (no REDIS_URL) never loads it, let alone connects. `maxRetriesPerRequest: null` is what BullMQ
 * requires of a worker's connection (a command waits out a Redis restart instead of failing the job).
 */
export async function openRedis(config: ClusterConfig, purpose: string): Promise<Redis> {
  const { Redis: RedisClient } = await import('ioredis');
  return new RedisClient(config.redisUrl, { maxRetriesPerRequest: null, connectionName: `morrowline-${config.role}-${purpose}-${process.pid}` });
}
