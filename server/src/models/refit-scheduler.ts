import { Injectable, Logger, type OnApplicationBootstrap, type OnApplicationShutdown } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { SchedulerRegistry } from '@nestjs/schedule';
import { CronJob } from 'cron';
import type { AppConfig } from '../config/configuration';
import { cronExpressions, loadRefitSchedule } from './refit-schedule';
import { RefitsService } from './refits.service';

/** How long after start the first check for zones without a model runs (feeds backfill first). */
const FIRST_MODEL_DELAY_MS = 3 * 60_000;

/**
 * When refits start by themselves: on start, jobs a stopped server left behind are marked failed;
 * then the nightly full refit and the hourly forecast update run on cron in desk time
 * (refit-schedule.ts), and a first check for zones without a model a little after start.
 * One machine only: in cluster mode the queue's job schedulers do this once per cluster.
 */
@Injectable()
export class RefitScheduler implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly logger = new Logger(RefitScheduler.name);
  private firstModelTimer: NodeJS.Timeout | null = null;
  private readonly deskTimeZone: string;

  constructor(
    private readonly refits: RefitsService,
    private readonly scheduler: SchedulerRegistry,
    config: ConfigService,
  ) {
    this.deskTimeZone = config.getOrThrow<AppConfig>('app').shifts.timeZone;
  }

  async onApplicationBootstrap(): Promise<void> {
    // In cluster mode another node may be running any unfinished job, and the schedules are the
    // queue's (../cluster/refit-job-schedulers.ts): nothing here.
    if (this.refits.clustered) return;
    await this.refits.recoverInterrupted();
    const schedule = loadRefitSchedule();
    if (!schedule.enabled) return;
    const cron = cronExpressions(schedule);
    const nightly = CronJob.from({ cronTime: cron.nightly, timeZone: this.deskTimeZone, start: true, onTick: () => void this.refits.scheduled('full') });
    const update = CronJob.from({ cronTime: cron.update, timeZone: this.deskTimeZone, start: true, onTick: () => void this.refits.scheduled('update') });
    this.scheduler.addCronJob('refit.nightly', nightly);
    this.scheduler.addCronJob('refit.hourly-update', update);
    this.logger.log(`nightly refit at ${cron.nightly}, forecast update at ${cron.update} (${this.deskTimeZone})`);
    // A new installation should not wait for the night to get its first models: a little after
    // start (time for the feeds to backfill), zones with enough history and no model are fitted.
    this.firstModelTimer = setTimeout(() => void this.refits.scheduled('update'), FIRST_MODEL_DELAY_MS);
    this.firstModelTimer.unref();
  }

  onApplicationShutdown(): void {
    if (this.firstModelTimer) clearTimeout(this.firstModelTimer);
  }
}
