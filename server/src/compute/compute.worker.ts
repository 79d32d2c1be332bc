/**
 * The compute pool's worker: looks the task up by name and runs it. Plain functions only, no
 * Nest (see ./compute-tasks for how to add one). Loaded by piscina as `dist/compute/compute.worker.js`
 * in the compiled server, and through ./compute.worker.bootstrap.js (which registers tsx) when
 * the server runs from TypeScript (jest, tsx).
 */
import { COMPUTE_TASKS, type ComputeRequest, type ComputeTaskName } from './compute-tasks';

export default function runComputeTask(request: ComputeRequest): unknown {
  const task = COMPUTE_TASKS[request.task as ComputeTaskName] as ((payload: unknown) => unknown) | undefined;
  if (!task) throw new Error(`No compute task named ${String(request.task)}`);
  return task(request.payload);
}
