import type { Queue } from 'bullmq';
import type { RefitDispatch, RefitDispatchJob } from '../models/refit-dispatch';
import type { ClusterConfig } from './cluster-config';
import { deduplicationIdFor, jobIdFor, jobNameFor, priorityFor, type QueuedRefit } from './refit-queue-jobs';

/**
 * Refit jobs onto the cluster's BullMQ queue: one queue job per stored job, de-duplicated per zone
 * and purpose, finished ones removed by age. `attempts` is 1: a fit that fails stores its failure
 * (RefitsService) and is not repeated; a worker that dies mid-fit is BullMQ's stalled-job case,
 * which hands the job to another worker (`maxStalledCount` in refit-worker-host.ts).
 */
export class BullRefitDispatch implements RefitDispatch {
  constructor(
    private readonly queue: Queue,
    private readonly config: ClusterConfig,
  ) {}

  async push(job: RefitDispatchJob): Promise<void> {
    const data: QueuedRefit = { refitJobId: job.refitJobId, zoneId: job.zoneId };
    await this.queue.add(jobNameFor(job.mode), data, {
      jobId: jobIdFor(job.refitJobId),
      deduplication: { id: deduplicationIdFor(job.zoneId, job.mode) },
      priority: priorityFor(job),
      attempts: 1,
      removeOnComplete: { age: this.config.keepCompletedSeconds },
      removeOnFail: { age: this.config.keepFailedSeconds },
    });
  }
}
