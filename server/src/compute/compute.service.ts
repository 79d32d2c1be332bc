import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import path from 'node:path';
import { Injectable, Logger, type OnModuleDestroy } from '@nestjs/common';
import { Piscina } from 'piscina';
import type { ComputePayload, ComputeRequest, ComputeResult, ComputeTaskName } from './compute-tasks';

function threadsFrom(value: string | undefined, fallback: number): number {
  if (value === undefined || value.trim() === '') return fallback;
  const n = Number(value);
  if (!Number.isInteger(n) || n < 1) throw new Error(`a thread count must be a positive integer, got "${value}"`);
  return n;
}

/**
 * Worker threads for interactive work (`COMPUTE_THREADS`, default one per core but one, so the
 * event loop keeps a core of its own).
 */
export function poolSize(cores = availableParallelism(), env: NodeJS.ProcessEnv = process.env): number {
  return threadsFrom(env.COMPUTE_THREADS, Math.max(1, cores - 1));
}

/**
 * Worker threads for the nightly batch (`COMPUTE_BATCH_THREADS`, default one per core): at night
 * nobody waits on the event loop for long, so the batch may use every core.
 */
export function batchPoolSize(cores = availableParallelism(), env: NodeJS.ProcessEnv = process.env): number {
  return threadsFrom(env.COMPUTE_BATCH_THREADS, Math.max(1, cores));
}

/**
 * The file piscina loads in each thread, the worker entry at the top of the source tree (it
 * imports the features' task tables, so the pool refers to it by name only): the compiled worker
 * when there is one (node dist/main.js), otherwise the bootstrap that registers tsx for the
 * TypeScript source.
 */
export function workerFilename(dir = path.join(__dirname, '..')): string {
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
  private batchPool: Piscina | null = null;

  readonly size = poolSize();
  readonly batchSize = batchPoolSize();

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

  /**
   * Runs a task of a batch (the nightly refit of every zone) in the batch pool, a separate pool
   * of `batchSize` threads whose threads stop ten seconds after the batch.
   */
  runBatch<K extends ComputeTaskName>(task: K, payload: ComputePayload<K>, signal?: AbortSignal): Promise<ComputeResult<K>> {
    if (!this.batchPool) {
      this.batchPool = new Piscina({ filename: workerFilename(), minThreads: 0, maxThreads: this.batchSize, idleTimeout: 10_000 });
      this.logger.log(`compute batch pool: up to ${this.batchSize} worker thread(s)`);
    }
    const request: ComputeRequest<K> = { task, payload };
    return this.batchPool.run(request, { signal }) as Promise<ComputeResult<K>>;
  }

  /** Tasks waiting for a free thread. */
  get queued(): number {
    return (this.pool?.queueSize ?? 0) + (this.batchPool?.queueSize ?? 0);
  }

  async onModuleDestroy(): Promise<void> {
    const pools = [this.pool, this.batchPool];
    this.pool = null;
    this.batchPool = null;
    await Promise.all(pools.map((p) => p?.destroy()));
  }
}
