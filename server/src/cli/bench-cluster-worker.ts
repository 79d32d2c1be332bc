/**
 * One worker process of `npm run bench:cluster`: a BullMQ worker on the bench's queue that fits
 * each zone it is given in its compute pool (one worker thread, COMPUTE_THREADS=1), as a cluster
 * worker fits a refit job: the job's lock is renewed on the event loop while the thread fits. The
 * history is synthesised from the job's seed (synthetic-history.ts) instead of read from MariaDB,
 * so the figure is the fits and the queue, not the database (README, "Cluster benchmark").
 */
import { Worker } from 'bullmq';
import { Redis } from 'ioredis';
import { ComputeService } from '../compute/compute.service';
import { forecastHorizon } from '../forecasts/forecast-horizon';
import { synthesise } from './synthetic-history';

import { BENCH_QUEUE } from './bench-cluster-queue';
const HOUR_MS = 3_600_000;

interface BenchJob {
  seed: number;
  peakMw: number;
  hours: number;
}

async function main(): Promise<void> {
  const compute = new ComputeService();
  const connection = new Redis(process.env.REDIS_URL!, { maxRetriesPerRequest: null });
  const last = Math.floor(Date.now() / HOUR_MS) * HOUR_MS - HOUR_MS;
  const horizon = forecastHorizon(last, 'America/Denver');
  const worker = new Worker<BenchJob>(
    BENCH_QUEUE,
    async (job) => {
      const { seed, peakMw, hours } = job.data;
      const r = await compute.run('models.refit', { values: synthesise(seed, peakMw, hours), excluded: [], horizon, inService: null, backtestDays: 7 });
      if (!r.forecast.mean.every((v) => Number.isFinite(v) && v >= 0)) throw new Error(`zone ${seed}: a forecast value is not a load`);
    },
    { connection, concurrency: 1 },
  );
  await worker.waitUntilReady();
  console.log('ready');
  const stop = async () => {
    await worker.close();
    await compute.onModuleDestroy();
    connection.disconnect();
    process.exit(0);
  };
  process.once('SIGTERM', () => void stop());
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
