import { type DynamicModule, Module } from '@nestjs/common';
import type { Queue } from 'bullmq';
import { ModelsModule } from '../models/models.module';
import { REFIT_DISPATCH } from '../models/refit-dispatch';
import { BullRefitDispatch } from './bull-refit-dispatch';
import { loadClusterConfig, type ClusterConfig } from './cluster-config';
import { CLUSTER_CONFIG, REFIT_QUEUE } from './cluster-tokens';
import { openRedis } from './redis-connection';
import { RefitJobSchedulers } from './refit-job-schedulers';
import { REFIT_QUEUE_NAME } from './refit-queue-jobs';
import { RefitWorkerHost } from './refit-worker-host';

/**
 * Cluster mode (REDIS_URL, cluster-config.ts). Without it this module is empty: no provider, and
 * bullmq and ioredis are never loaded (they are imported for their types only, and loaded with
 * `import()` inside the factories). With it: the refit queue, the dispatch RefitsService sends its
 * jobs to, the job schedulers every node upserts, and — in a worker process — the queue's worker.
 */
@Module({})
export class ClusterModule {
  static forRoot(config: ClusterConfig | null = loadClusterConfig()): DynamicModule {
    if (!config) return { module: ClusterModule };
    return {
      module: ClusterModule,
      global: true,
      imports: [ModelsModule],
      providers: [
        { provide: CLUSTER_CONFIG, useValue: config },
        {
          provide: REFIT_QUEUE,
          useFactory: async (): Promise<Queue> => {
            const { Queue: BullQueue } = await import('bullmq');
            return new BullQueue(REFIT_QUEUE_NAME, { connection: await openRedis(config, 'queue', { failFast: true }) });
          },
        },
        { provide: REFIT_DISPATCH, useFactory: (queue: Queue) => new BullRefitDispatch(queue, config), inject: [REFIT_QUEUE] },
        RefitJobSchedulers,
        RefitWorkerHost,
      ],
      exports: [CLUSTER_CONFIG, REFIT_QUEUE, REFIT_DISPATCH],
    };
  }
}
