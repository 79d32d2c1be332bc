import { loadClusterConfig } from './cluster-config';

describe('cluster configuration', () => {
  it('is off without REDIS_URL: one machine, nothing to connect to', () => {
    expect(loadClusterConfig({})).toBeNull();
    expect(loadClusterConfig({ REDIS_URL: '' })).toBeNull();
  });

  it('reads the URL, the role and the defaults', () => {
    expect(loadClusterConfig({ REDIS_URL: 'redis://127.0.0.1:6390' })).toEqual({
      redisUrl: 'redis://127.0.0.1:6390',
      role: 'api',
      workerJobs: 1,
      jobLockMs: 30_000,
      keepCompletedSeconds: 24 * 3600,
      keepFailedSeconds: 7 * 24 * 3600,
    });
    const worker = loadClusterConfig({ REDIS_URL: 'rediss://cache.example:6380/2', MORROWLINE_ROLE: 'worker', CLUSTER_WORKER_JOBS: '3', CLUSTER_JOB_LOCK_MS: '5000' });
    expect(worker).toMatchObject({ role: 'worker', workerJobs: 3, jobLockMs: 5000 });
  });

  it('refuses what it cannot use, naming the setting', () => {
    expect(() => loadClusterConfig({ REDIS_URL: '127.0.0.1:6379' })).toThrow(/REDIS_URL/);
    expect(() => loadClusterConfig({ REDIS_URL: 'http://127.0.0.1:6379' })).toThrow(/REDIS_URL/);
    expect(() => loadClusterConfig({ REDIS_URL: 'redis://h:1', MORROWLINE_ROLE: 'both' })).toThrow(/MORROWLINE_ROLE/);
    expect(() => loadClusterConfig({ MORROWLINE_ROLE: 'worker' })).toThrow(/needs REDIS_URL/);
    expect(() => loadClusterConfig({ REDIS_URL: 'redis://h:1', CLUSTER_WORKER_JOBS: '0' })).toThrow(/CLUSTER_WORKER_JOBS/);
    expect(() => loadClusterConfig({ REDIS_URL: 'redis://h:1', CLUSTER_JOB_LOCK_MS: '1.5e4' })).toThrow(/CLUSTER_JOB_LOCK_MS/);
  });
});
