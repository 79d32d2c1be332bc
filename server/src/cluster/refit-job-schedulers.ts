import { Inject, Injectable, Logger, type OnApplicationBootstrap, type OnApplicationShutdown } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { Queue } from 'bullmq';
import type { AppConfig } from '../config/configuration';
import { cronExpressions, loadRefitSchedule } from '../models/refit-schedule';
import { CLUSTER_CONFIG, REFIT_QUEUE } from './cluster-tokens';
import type { ClusterConfig } from './cluster-config';
import { QUEUE_JOB, SCHEDULER_ID } from './refit-queue-jobs';

/**
 * The nightly full refit and the hourly forecast update as BullMQ job schedulers. Every node
 * upserts both at start with the same ids, so Redis holds one of each and each occurrence is one
 * queue job, taken by one worker, however many nodes are up (a per-process cron would start it
 * once per node). The times are the single machine's (REFIT_NIGHTLY_AT, FORECAST_UPDATE_MINUTE, in
 * desk time); REFIT_SCHEDULE=off removes them.
 */
@Injectable()
export class RefitJobSchedulers implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly logger = new Logger(RefitJobSchedulers.name);
  private readonly deskTimeZone: string;

  constructor(
    @Inject(REFIT_QUEUE) private readonly queue: Queue,
    @Inject(CLUSTER_CONFIG) private readonly cluster: ClusterConfig,
    config: ConfigService,
  ) {
    this.deskTimeZone = config.getOrThrow<AppConfig>('app').shifts.timeZone;
  }

  async onApplicationBootstrap(): Promise<void> {
    const schedule = loadRefitSchedule();
    if (!schedule.enabled) {
      await this.queue.removeJobScheduler(SCHEDULER_ID.nightly);
      await this.queue.removeJobScheduler(SCHEDULER_ID.hourly);
      return;
    }
    const cron = cronExpressions(schedule);
    const keep = { removeOnComplete: { age: this.cluster.keepCompletedSeconds }, removeOnFail: { age: this.cluster.keepFailedSeconds } };
    await this.queue.upsertJobScheduler(SCHEDULER_ID.nightly, { pattern: cron.nightly, tz: this.deskTimeZone }, { name: QUEUE_JOB.nightly, data: {}, opts: keep });
    await this.queue.upsertJobScheduler(SCHEDULER_ID.hourly, { pattern: cron.update, tz: this.deskTimeZone }, { name: QUEUE_JOB.hourly, data: {}, opts: keep });
    this.logger.log(`cluster schedules: nightly refit at ${cron.nightly}, forecast update at ${cron.update} (${this.deskTimeZone})`);
  }

  /** The queue's connection closes with the process (the queue outlives every other user of it). */
  async onApplicationShutdown(): Promise<void> {
    await this.queue.close();
  }
}
