import type { RefitTrigger } from '@morrowline/shared';

/**
 * Where a stored refit job goes to be run. Absent on one machine (RefitsService runs it in its own
 * in-process queue); in cluster mode, the BullMQ queue (../cluster/bull-refit-dispatch.ts), from
 * which any worker process takes it.
 */
export const REFIT_DISPATCH = Symbol('REFIT_DISPATCH');

export interface RefitDispatchJob {
  refitJobId: number;
  zoneId: number;
  mode: 'full' | 'update';
  trigger: RefitTrigger;
}

export interface RefitDispatch {
  /** Resolves once the job is in the queue (Redis has acknowledged it). */
  push(job: RefitDispatchJob): Promise<void>;
}
