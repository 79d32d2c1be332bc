import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import path from 'node:path';
import { Injectable, Logger, type OnModuleDestroy } from '@nestjs/common';
import { Piscina } from 'piscina';
import type { ComputePayload, ComputeRequest, ComputeResult, ComputeTaskName } from './compute-tasks';

/** Worker threads: one per core but one, so the event loop keeps a core of its own. */
export function poolSize(cores = availableParallelism()): number {
  return Math.max(1, cores - 1);
}

/**
 * The file piscina loads in each thread: the compiled worker next to this file when there is
 * one (node dist/main.js), otherwise the bootstrap that registers tsx for the TypeScript source.
 */
export function workerFilename(dir = __dirname): string {
  const compiled = path.join(dir, 'compute.worker.js');
  if (existsSync(compiled)) return compiled;
  return path.join(dir, 'compute.worker.bootstrap.js');
}

/**
 * The engine's worker-thread pool (piscina). Heavy computation (stationarity analysis, fits,
 * backtests, refits) goes through `run`, never onto the event loop. Threads start on the
 * first task and stop after a minute idle.
 */
@Injectable()
export class ComputeService implements OnModuleDestroy {
  private readonly logger = new Logger(ComputeService.name);
  private pool: Piscina | null = null;

  readonly size = poolSize();

  private get piscina(): Piscina {
    if (!this.pool) {
      this.pool = new Piscina({ filename: workerFilename(), minThreads: 0, maxThreads: this.size, idleTimeout: 60_000 });
      this.logger.log(`compute pool: up to ${this.size} worker thread(s) from ${path.basename(workerFilename())}`);
    }
    return this.pool;
  }

  /** Runs a registered task in a worker thread. */
  run<K extends ComputeTaskName>(task: K, payload: ComputePayload<K>, signal?: AbortSignal): Promise<ComputeResult<K>> {
    const request: ComputeRequest<K> = { task, payload };
    return this.piscina.run(request, { signal }) as Promise<ComputeResult<K>>;
  }

  /** Tasks waiting for a free thread. */
  get queued(): number {
    return this.pool?.queueSize ?? 0;
  }

  async onModuleDestroy(): Promise<void> {
    const pool = this.pool;
    this.pool = null;
    if (pool) await pool.destroy();
  }
}
