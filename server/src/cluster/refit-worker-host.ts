import { Inject, Injectable, Logger, type OnApplicationShutdown } from '@nestjs/common';
import type { Job, Worker } from 'bullmq';
import { RefitsService } from '../models/refits.service';
import type { ClusterConfig } from './cluster-config';
import { CLUSTER_CONFIG } from './cluster-tokens';
import { openRedis } from './redis-connection';
import { QUEUE_JOB, REFIT_QUEUE_NAME, queuedRefitFrom } from './refit-queue-jobs';

/**
 * A worker process's side of the queue (MORROWLINE_ROLE=worker, `npm run worker`): takes refit,
 * forecast-update and schedule jobs and runs them through RefitsService, whose fits run in this
 * process's compute pool (worker threads), so the event loop stays free to renew the job's lock
 * however long a fit takes. A worker that dies mid-fit stops renewing it: after
 * CLUSTER_JOB_LOCK_MS another worker's stalled-job check takes the job over (RefitsService starts
 * it again from the history; what was stored is never stored twice). A job that stalls more than
 * twice is given up and its stored job marked failed.
 */
@Injectable()
export class RefitWorkerHost implements OnApplicationShutdown {
  private readonly logger = new Logger(RefitWorkerHost.name);
  private worker: Worker | null = null;

  constructor(
    private readonly refits: RefitsService,
    @Inject(CLUSTER_CONFIG) private readonly cluster: ClusterConfig,
  ) {}

  /** Starts taking jobs (called by the worker entry once the desk relay is in place). */
  async start(): Promise<void> {
    if (this.worker) return;
    const { Worker: BullWorker } = await import('bullmq');
    const connection = await openRedis(this.cluster, 'worker');
    const worker = new BullWorker(REFIT_QUEUE_NAME, (job) => this.process(job), {
      connection,
      concurrency: this.cluster.workerJobs,
      lockDuration: this.cluster.jobLockMs,
      stalledInterval: this.cluster.jobLockMs,
      maxStalledCount: 2,
    });
    worker.on('failed', (job, error) => void this.onFailed(job, error));
    worker.on('error', (error) => this.logger.error(`queue: ${error.message}`));
    this.worker = worker;
    await worker.waitUntilReady();
    this.logger.log(`taking jobs from ${REFIT_QUEUE_NAME}: ${this.cluster.workerJobs} at once, lock ${this.cluster.jobLockMs} ms`);
  }

  async onApplicationShutdown(): Promise<void> {
    await this.worker?.close();
    this.worker = null;
  }

  private async process(job: Job): Promise<void> {
    switch (job.name) {
      case QUEUE_JOB.refit:
      case QUEUE_JOB.forecastUpdate:
        await this.refits.runFromQueue(queuedRefitFrom(job.data).refitJobId, testHold());
        return;
      case QUEUE_JOB.nightly:
        await this.refits.scheduled('full');
        return;
      case QUEUE_JOB.hourly:
        await this.refits.requeueUnfinished();
        await this.refits.scheduled('update');
        return;
      default:
        throw new Error(`no such job kind: ${job.name}`);
    }
  }

  /** BullMQ gave a refit up (it stalled too often): the stored job is failed so the zone is free. */
  private async onFailed(job: Job | undefined, error: Error): Promise<void> {
    if (!job || (job.name !== QUEUE_JOB.refit && job.name !== QUEUE_JOB.forecastUpdate)) return;
    this.logger.warn(`queue job ${job.id} given up: ${error.message}`);
    await this.refits.failFromQueue(queuedRefitFrom(job.data).refitJobId, `the workers running it stopped (${error.message})`);
  }
}

/**
 * Tests only (NODE_ENV=test): CLUSTER_TEST_HOLD_FIT_MS holds each fit this long after it starts,
 * so the cluster test can kill the worker while it is fitting. Ignored outside tests.
 */
function testHold(): (() => Promise<void>) | undefined {
  const ms = Number(process.env.CLUSTER_TEST_HOLD_FIT_MS ?? 0);
  if (process.env.NODE_ENV !== 'test' || !(ms > 0)) return undefined;
  return () => new Promise((resolve) => setTimeout(resolve, ms));
}
