/**
 * The task registry of the compute pool: the name, payload and result of every task a worker
 * thread can run.
 *
 * A task is a plain function of one structured-cloneable payload (numbers, arrays, typed arrays,
 * plain objects) that returns a structured-cloneable result. It must not import Nest, the ORM
 * or anything with I/O: it runs in a worker thread that only loads the worker entry
 * (`src/compute.worker.ts`) and what it imports. The pool knows no feature: each feature declares
 * its tasks beside its analysis code and adds them to `ComputeTasks` below by declaration merging
 * (see `models/analysis/model-tasks.ts`). To add a task: write the function, add it to its
 * feature's table and to the `declare module` block there, make sure the feature's table is
 * spread into the worker entry's, and call `compute.run('feature.task', payload)`, typed from here.
 */
import { threadId } from 'node:worker_threads';

/** The pool's own tasks. */
export const COMPUTE_OWN_TASKS = {
  /** A trivial task for checking that the pool starts (tests, health). */
  'compute.echo': (payload: { value: number }) => ({ value: payload.value, threadId }),
};

/** Every task by name; the features add theirs (`declare module '…/compute/compute-tasks'`). */
export interface ComputeTasks {
  'compute.echo': (typeof COMPUTE_OWN_TASKS)['compute.echo'];
}

export type ComputeTaskName = keyof ComputeTasks;
export type ComputePayload<K extends ComputeTaskName> = Parameters<ComputeTasks[K]>[0];
export type ComputeResult<K extends ComputeTaskName> = ReturnType<ComputeTasks[K]>;

/** What the pool posts to a worker. */
export interface ComputeRequest<K extends ComputeTaskName = ComputeTaskName> {
  task: K;
  payload: ComputePayload<K>;
}
