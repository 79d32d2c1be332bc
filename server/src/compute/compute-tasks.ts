/**
 * The task registry of the compute pool: every task a worker thread can run, by name.
 *
 * A task is a plain function of one structured-cloneable payload (numbers, arrays, typed arrays,
 * plain objects) that returns a structured-cloneable result. It must not import Nest, the ORM
 * or anything with I/O: it runs in a worker thread that only loads this file and what it
 * imports. To add a task, write the function beside its feature (e.g.
 * `src/models/analysis/refit.ts`), add one line below, and call
 * `compute.run('models.refit', payload)`: the names, payloads and results are typed from here.
 */
import { threadId } from 'node:worker_threads';
import { analyseModel } from '../workbench/analysis/model-analysis';
import { compareChoices, forecastStored, refitZone } from '../models/analysis/refit';
import { runWorkbenchBacktest } from '../workbench/analysis/backtest-analysis';
import { analyseStationarity } from '../workbench/analysis/stationarity-analysis';

export const COMPUTE_TASKS = {
  'workbench.stationarity': analyseStationarity,
  'workbench.model': analyseModel,
  'workbench.backtest': runWorkbenchBacktest,
  'models.refit': refitZone,
  'models.forecast': forecastStored,
  'models.compare': compareChoices,
  /** A trivial task for checking that the pool starts (tests, health). */
  'compute.echo': (payload: { value: number }) => ({ value: payload.value, threadId }),
} as const;

export type ComputeTaskName = keyof typeof COMPUTE_TASKS;
export type ComputePayload<K extends ComputeTaskName> = Parameters<(typeof COMPUTE_TASKS)[K]>[0];
export type ComputeResult<K extends ComputeTaskName> = ReturnType<(typeof COMPUTE_TASKS)[K]>;

/** What the pool posts to a worker. */
export interface ComputeRequest<K extends ComputeTaskName = ComputeTaskName> {
  task: K;
  payload: ComputePayload<K>;
}
