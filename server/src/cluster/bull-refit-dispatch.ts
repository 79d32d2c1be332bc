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
    const jobId = jobIdFor(job.refitJobId);
    const added = await this.queue.add(jobNameFor(job.mode), data, {
      jobId,
      deduplication: { id: deduplicationIdFor(job.zoneId, job.mode) },
      priority: priorityFor(job),
      attempts: 1,
      removeOnComplete: { age: this.config.keepCompletedSeconds },
      removeOnFail: { age: this.config.keepFailedSeconds },
    });
    // Joined to another queue job of the same zone and purpose: that stored job has finished but
    // its queue job has not quite (the moment between the two); this one would never run.
    if (added.id !== jobId) throw new Error(`the zone's previous ${jobNameFor(job.mode)} is still finishing on a worker; ask again in a moment`);
  }
}
