import type { RefitDispatchJob } from '../models/refit-dispatch';

/** The one BullMQ queue of the cluster: refits and forecast updates, and the schedules that start them. */
export const REFIT_QUEUE_NAME = 'morrowline-refits';

/** Job names: what a worker does with the job. */
export const QUEUE_JOB = {
  /** A full refit of one zone (differencing, orders, estimates, forecast). */
  refit: 'refit',
  /** The hourly forecast update of one zone (orders kept, estimates and forecast renewed). */
  forecastUpdate: 'forecast-update',
  /** Starts the nightly full refit of every active zone. */
  nightly: 'nightly-refit',
  /** Starts the hourly forecast update of every zone in service (and first models). */
  hourly: 'hourly-update',
} as const;

/** Scheduler ids: every node upserts the same two, so Redis holds one of each for the cluster. */
export const SCHEDULER_ID = { nightly: 'refit-nightly', hourly: 'forecast-hourly-update' } as const;

export interface QueuedRefit {
  refitJobId: number;
  zoneId: number;
}

/** The queue job's name for a refit job's purpose. */
export function jobNameFor(mode: RefitDispatchJob['mode']): string {
  return mode === 'full' ? QUEUE_JOB.refit : QUEUE_JOB.forecastUpdate;
}

/**
 * The queue job's id: the stored refit job's, so a second push of the same stored job (a retry of
 * the request) is the same queue job. BullMQ refuses ids with ':' (its key separator) and ids that
 * are whole numbers.
 */
export function jobIdFor(refitJobId: number): string {
  return `refit-job-${refitJobId}`;
}

/**
 * The de-duplication id, one per zone and purpose: while such a job waits or runs, another for the
 * same zone and purpose joins it (BullMQ's `deduplication`) instead of queueing a second fit. The
 * database says the same first (one unfinished refit job per zone, `refit_jobs.active_zone_id`);
 * this holds it in the queue too.
 */
export function deduplicationIdFor(zoneId: number, mode: RefitDispatchJob['mode']): string {
  return `zone-${zoneId}-${jobNameFor(mode)}`;
}

/**
 * Order among waiting jobs (BullMQ: lower runs first): a refit someone asked for goes ahead of the
 * scheduled batch, so an operator does not wait behind the night's two thousand zones.
 */
export function priorityFor(job: RefitDispatchJob): number {
  return job.trigger === 'operator' ? 1 : 10;
}

/** Reads the stored job's id back from a queue job's data; anything else is refused. */
export function queuedRefitFrom(data: unknown): QueuedRefit {
  const d = data as Partial<QueuedRefit> | null;
  if (!d || !Number.isSafeInteger(d.refitJobId) || (d.refitJobId as number) < 1 || !Number.isSafeInteger(d.zoneId)) {
    throw new Error(`not a refit job: ${JSON.stringify(data)}`);
  }
  return { refitJobId: d.refitJobId as number, zoneId: d.zoneId as number };
}
