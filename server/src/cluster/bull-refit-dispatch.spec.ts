import type { Queue } from 'bullmq';
import { BullRefitDispatch } from './bull-refit-dispatch';
import { loadClusterConfig } from './cluster-config';

/** A stand-in for BullMQ's Queue.add: records the call, answers the id BullMQ would (the existing job's when de-duplicated). */
function fakeQueue(answerId?: string) {
  const calls: { name: string; data: unknown; opts: Record<string, unknown> }[] = [];
  const queue = {
    add: async (name: string, data: unknown, opts: Record<string, unknown>) => {
      calls.push({ name, data, opts });
      return { id: answerId ?? opts.jobId };
    },
  };
  return { calls, queue: queue as unknown as Queue };
}

describe('refit jobs onto the BullMQ queue', () => {
  const config = loadClusterConfig({ REDIS_URL: 'redis://127.0.0.1:6390', CLUSTER_KEEP_JOBS_HOURS: '12' })!;

  it('adds one queue job per stored job, de-duplicated per zone and purpose, removed by age', async () => {
    const { calls, queue } = fakeQueue();
    await new BullRefitDispatch(queue, config).push({ refitJobId: 41, zoneId: 3, mode: 'update', trigger: 'update' });
    expect(calls).toEqual([
      {
        name: 'forecast-update',
        data: { refitJobId: 41, zoneId: 3 },
        opts: {
          jobId: 'refit-job-41',
          deduplication: { id: 'zone-3-forecast-update' },
          priority: 10,
          attempts: 1,
          removeOnComplete: { age: 12 * 3600 },
          removeOnFail: { age: 7 * 24 * 3600 },
        },
      },
    ]);
  });

  it('refuses to leave a stored job joined to another zone job it will never be run by', async () => {
    const { queue } = fakeQueue('refit-job-40');
    await expect(new BullRefitDispatch(queue, config).push({ refitJobId: 41, zoneId: 3, mode: 'full', trigger: 'operator' })).rejects.toThrow(/previous refit is still finishing/);
  });
});
