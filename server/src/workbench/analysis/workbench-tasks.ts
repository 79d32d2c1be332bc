/** The workbench's tasks for the compute pool (run in worker threads: see src/compute.worker.ts). */
import type { ComputeTasks } from '../../compute/compute-tasks';
import { runWorkbenchBacktest } from './backtest-analysis';
import { analyseModel } from './model-analysis';
import { analyseStationarity } from './stationarity-analysis';

declare module '../../compute/compute-tasks' {
  interface ComputeTasks {
    'workbench.stationarity': typeof analyseStationarity;
    'workbench.model': typeof analyseModel;
    'workbench.backtest': typeof runWorkbenchBacktest;
  }
}

export const WORKBENCH_TASKS = {
  'workbench.stationarity': analyseStationarity,
  'workbench.model': analyseModel,
  'workbench.backtest': runWorkbenchBacktest,
} satisfies Partial<ComputeTasks>;
