/**
 * The compute pool's worker thread: every task table of the features, looked up by name. This is
 * the worker's composition root, as app.module.ts is the server's: it depends on the features,
 * the pool in ./compute depends on none (it loads this file by name). Plain functions only, no
 * Nest (see ./compute/compute-tasks for how to add a task). Loaded by piscina as
 * `dist/compute.worker.js` in the compiled server, and through ./compute.worker.bootstrap.js
 * (which registers tsx) when the server runs from TypeScript (jest, tsx).
 */
import { COMPUTE_OWN_TASKS, type ComputeRequest, type ComputeTaskName, type ComputeTasks } from './compute/compute-tasks';
import { MODEL_TASKS } from './models/analysis/model-tasks';
import { WORKBENCH_TASKS } from './workbench/analysis/workbench-tasks';

/** Typed as the registry: a task declared by a feature but missing here does not compile. */
const TASKS: ComputeTasks = { ...COMPUTE_OWN_TASKS, ...MODEL_TASKS, ...WORKBENCH_TASKS };

export default function runComputeTask(request: ComputeRequest): unknown {
  const task = TASKS[request.task as ComputeTaskName] as ((payload: unknown) => unknown) | undefined;
  if (!task) throw new Error(`No compute task named ${String(request.task)}`);
  return task(request.payload);
}
