/**
 * Cluster mode, from the environment (documented in the README). Without REDIS_URL the server is
 * one machine, exactly as before: refits in this process's worker threads, crons in this process,
 * desks on this node only, and nothing connects to Redis.
 *   REDIS_URL                 redis://host:port[/db] — switches cluster mode on
 *   MORROWLINE_ROLE           api (default: serves HTTP and desks, queues jobs) or worker
 *                             (`npm run worker`: runs refit and forecast jobs, serves nothing)
 *   CLUSTER_WORKER_JOBS       jobs one worker process runs at once (default 1; its fits go to
 *                             the worker threads of its compute pool either way)
 *   CLUSTER_JOB_LOCK_MS       how long a job's lock lasts without renewal before another worker
 *                             may take the job over (default 30000; a killed worker's job waits
 *                             this long)
 *   CLUSTER_KEEP_JOBS_HOURS   how long finished jobs stay in Redis (default 24; failed: 7 days)
 */
export type ClusterRole = 'api' | 'worker';

export interface ClusterConfig {
  redisUrl: string;
  role: ClusterRole;
  workerJobs: number;
  jobLockMs: number;
  keepCompletedSeconds: number;
  keepFailedSeconds: number;
}

function wholeNumber(env: NodeJS.ProcessEnv, name: string, fallback: number, min: number, max: number): number {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  if (!/^\d+$/.test(raw) || Number(raw) < min || Number(raw) > max) {
    throw new Error(`Configuration: ${name} must be a whole number ${min}–${max}, got "${raw}"`);
  }
  return Number(raw);
}

/** Null when cluster mode is off (no REDIS_URL); a refused value is an error at start, never a guess. */
export function loadClusterConfig(env: NodeJS.ProcessEnv = process.env): ClusterConfig | null {
  const redisUrl = env.REDIS_URL ?? '';
  const role = env.MORROWLINE_ROLE || 'api';
  if (role !== 'api' && role !== 'worker') throw new Error(`Configuration: MORROWLINE_ROLE must be api or worker, got "${role}"`);
  if (redisUrl === '') {
    if (role === 'worker') throw new Error('Configuration: a worker needs REDIS_URL (the queue it takes jobs from)');
    return null;
  }
  let url: URL;
  try {
    url = new URL(redisUrl);
  } catch {
    throw new Error(`Configuration: REDIS_URL must be a URL such as redis://127.0.0.1:6379, got "${redisUrl}"`);
  }
  if (url.protocol !== 'redis:' && url.protocol !== 'rediss:') {
    throw new Error(`Configuration: REDIS_URL must start with redis:// or rediss://, got "${url.protocol}"`);
  }
  const keepHours = wholeNumber(env, 'CLUSTER_KEEP_JOBS_HOURS', 24, 1, 24 * 90);
  return {
    redisUrl,
    role,
    workerJobs: wholeNumber(env, 'CLUSTER_WORKER_JOBS', 1, 1, 64),
    jobLockMs: wholeNumber(env, 'CLUSTER_JOB_LOCK_MS', 30_000, 1_000, 600_000),
    keepCompletedSeconds: keepHours * 3600,
    keepFailedSeconds: Math.max(keepHours, 7 * 24) * 3600,
  };
}
