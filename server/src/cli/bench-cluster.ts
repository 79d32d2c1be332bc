/**
 * Cluster benchmark (`npm run bench:cluster [-- --zones Z] [--workers 1,2,4]`): the nightly full
 * refit of Z zones x 8 weeks (default 2,000) spread over W worker processes through a BullMQ queue
 * on the bench's Redis (scripts/bench-cluster.sh starts it), for each W, and the same zones through
 * the single machine's batch pool (bench:refit's path) in the same run. Fits only: the histories
 * are synthesised in every process from the zone's seed, nothing is read from or written to
 * MariaDB (its cost is bench:ingest's figure; README puts them together).
 * Last line: "cluster: Z zones x H hours on W workers in S s" for the largest W.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { availableParallelism, loadavg } from 'node:os';
import { join } from 'node:path';
import { Queue, QueueEvents } from 'bullmq';
import { Redis } from 'ioredis';
import { ComputeService } from '../compute/compute.service';
import { forecastHorizon } from '../forecasts/forecast-horizon';
import { BENCH_QUEUE } from './bench-cluster-queue';
import { synthesise } from './synthetic-history';

const HOURS = 8 * 168;
const HOUR_MS = 3_600_000;

function options(argv: string[]): { zones: number; workers: number[] } {
  let zones = 2000;
  let workers = [1, 2, 4];
  for (let i = 0; i < argv.length; i++) {
    if (argv[i] === '--zones') zones = Number(argv[++i]);
    else if (argv[i] === '--workers') workers = (argv[++i] ?? '').split(',').map(Number);
    else throw new Error(`unknown option ${argv[i]} (use --zones Z, --workers 1,2,4)`);
  }
  if (!Number.isInteger(zones) || zones < 1) throw new Error('--zones must be a positive whole number');
  if (!workers.length || workers.some((w) => !Number.isInteger(w) || w < 1)) throw new Error('--workers must list positive whole numbers');
  return { zones, workers };
}

const zoneOf = (i: number) => ({ seed: 1000 + i, peakMw: 80 + (i % 40) * 8, hours: HOURS });

/** The single machine's path: every zone through ComputeService.runBatch in this process. */
async function singleMachine(zones: number): Promise<{ seconds: number; threads: number }> {
  const compute = new ComputeService();
  try {
    const last = Math.floor(Date.now() / HOUR_MS) * HOUR_MS - HOUR_MS;
    const horizon = forecastHorizon(last, 'America/Denver');
    const fit = (i: number) => {
      const z = zoneOf(i);
      return compute.runBatch('models.refit', { values: synthesise(z.seed, z.peakMw, z.hours), excluded: [], horizon, inService: null, backtestDays: 7 });
    };
    await Promise.all(Array.from({ length: compute.batchSize }, (_, i) => fit(-1 - i))); // warm the threads
    const t0 = performance.now();
    await Promise.all(Array.from({ length: zones }, (_, i) => fit(i)));
    return { seconds: (performance.now() - t0) / 1000, threads: compute.batchSize };
  } finally {
    await compute.onModuleDestroy();
  }
}

function startWorker(redisUrl: string): Promise<ChildProcess> {
  const child = spawn(process.execPath, ['-r', 'tsx/cjs', join(__dirname, 'bench-cluster-worker.ts')], {
    env: { ...process.env, REDIS_URL: redisUrl, COMPUTE_THREADS: '1' },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  return new Promise((resolve, reject) => {
    child.stdout!.on('data', (chunk: Buffer) => {
      if (chunk.toString().includes('ready')) resolve(child);
    });
    child.once('exit', (code) => reject(new Error(`a bench worker exited with ${code}`)));
  });
}

/** Z zones through the queue to W fresh worker processes (each warmed with one fit first). */
async function clusterRun(redisUrl: string, zones: number, workers: number): Promise<number> {
  const connection = new Redis(redisUrl, { maxRetriesPerRequest: null });
  const queue = new Queue(BENCH_QUEUE, { connection });
  const eventsConnection = new Redis(redisUrl, { maxRetriesPerRequest: null });
  const events = new QueueEvents(BENCH_QUEUE, { connection: eventsConnection });
  await queue.obliterate({ force: true });
  await events.waitUntilReady();
  const children = await Promise.all(Array.from({ length: workers }, () => startWorker(redisUrl)));
  let completed = 0;
  let failed: string | null = null;
  let target = 0;
  let onDone: () => void = () => {};
  events.on('completed', () => {
    completed++;
    if (completed >= target) onDone();
  });
  events.on('failed', ({ failedReason }) => {
    failed = failedReason;
    onDone();
  });
  const batch = async (from: number, count: number) => {
    completed = 0;
    target = count;
    const done = new Promise<void>((resolve) => (onDone = resolve));
    await queue.addBulk(Array.from({ length: count }, (_, i) => ({ name: 'refit', data: zoneOf(from + i), opts: { removeOnComplete: { age: 3600 }, removeOnFail: { age: 3600 } } })));
    await done;
    if (failed) throw new Error(`a bench fit failed: ${failed}`);
  };
  try {
    await batch(-10_000, workers); // one warm-up fit per worker (module load, JIT)
    const t0 = performance.now();
    await batch(0, zones);
    return (performance.now() - t0) / 1000;
  } finally {
    for (const child of children) child.kill('SIGTERM');
    await Promise.all(children.map((c) => new Promise((resolve) => (c.exitCode !== null ? resolve(null) : c.once('exit', resolve)))));
    await events.close();
    await queue.obliterate({ force: true });
    await queue.close();
    // BullMQ leaves connections it was given open
    connection.disconnect();
    eventsConnection.disconnect();
  }
}

async function main(): Promise<void> {
  const { zones, workers } = options(process.argv.slice(2));
  const redisUrl = process.env.REDIS_URL;
  if (!redisUrl) throw new Error('REDIS_URL is not set (scripts/bench-cluster.sh starts the bench Redis)');
  const cores = availableParallelism();
  console.log(`cluster benchmark: ${zones} zones x ${HOURS} hours full refit, ${cores} cores, ${new Date().toISOString().slice(0, 10)}; fits only (histories synthesised, no database)\n`);

  const single = await singleMachine(zones);
  console.log(`single machine (bench:refit's batch pool, ${single.threads} threads): ${zones} zones in ${single.seconds.toFixed(1)} s, ${((single.seconds / zones) * 1000).toFixed(0)} ms per zone`);

  const times = new Map<number, number>();
  console.log('\nworker processes (one fit at a time each, one compute thread each):');
  for (const w of workers) {
    const s = await clusterRun(redisUrl, zones, w);
    times.set(w, s);
    const base = times.get(workers[0])!;
    const speedUp = (base / s) * (workers[0] / 1);
    const usedCores = Math.min(w, cores);
    console.log(
      `  ${w} worker(s): ${s.toFixed(1)} s, ${(zones / s).toFixed(2)} zones/s, speed-up ${speedUp.toFixed(2)}x over ${workers[0]} worker(s), ${(speedUp / usedCores).toFixed(2)} per core used (${usedCores} of ${cores})`,
    );
  }
  const largest = workers[workers.length - 1];
  // the machine is shared: other work on it shows here and in the figures above
  console.log(`\nload average at the end: ${loadavg().map((l) => l.toFixed(1)).join(' ')} (${cores} cores)`);
  console.log(`cluster: ${zones} zones x ${HOURS} hours on ${largest} workers in ${times.get(largest)!.toFixed(1)} s`);
}

main()
  .then(() => process.exit(0))
  .catch((error: unknown) => {
    console.error(error instanceof Error ? error.message : error);
    process.exit(1);
  });
