/** The models' tasks for the compute pool (run in worker threads: see src/compute.worker.ts). */
import type { ComputeTasks } from '../../compute/compute-tasks';
import { scoreAtIssueTimes } from './issue-time-score';
import { forecastStored, refitZone } from './refit';

declare module '../../compute/compute-tasks' {
  interface ComputeTasks {
    'models.refit': typeof refitZone;
    'models.forecast': typeof forecastStored;
    'models.score-at-issue': typeof scoreAtIssueTimes;
  }
}

export const MODEL_TASKS = {
  'models.refit': refitZone,
  'models.forecast': forecastStored,
  'models.score-at-issue': scoreAtIssueTimes,
} satisfies Partial<ComputeTasks>;
