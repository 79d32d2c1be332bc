/**
 * Refit benchmark (`npm run bench:refit`): the nightly full refit (differencing and order
 * selection, the 7-day scoring backtest, the forecast) through the server's own batch pool
 * (`ComputeService.runBatch`, `COMPUTE_BATCH_THREADS`, default one thread per core),
 * engine only — no database: the histories are synthesised in memory with the daily and weekly
 * cycles, noise and the odd missing hour of the demo zones.
 *   1. the five demo zones of the Tallowmere Valley Electric Cooperative;
 *   2. growth with history length: 20 zones at 4, 8 and 12 weeks;
 *   3. the scaled case, 200 zones x 8 weeks, with the elapsed time as zones complete.
 * Last line: "refit: Z zones x H hours in S s" for the scaled case.
 */
import { DEMO_ZONES } from '@morrowline/shared';
import { ComputeService } from '../compute/compute.service';
import { forecastHorizon } from '../forecasts/forecast-horizon';
import { synthesise } from './synthetic-history';

const HOUR_MS = 3_600_000;

async function refitAll(compute: ComputeService, zones: { seed: number; peakMw: number }[], hours: number, onDone?: (done: number, ms: number) => void): Promise<number> {
  const t0 = performance.now();
  const last = Math.floor(Date.now() / HOUR_MS) * HOUR_MS - HOUR_MS;
  const horizon = forecastHorizon(last, 'America/Denver');
  let done = 0;
  await Promise.all(
    zones.map(async (z) => {
      const r = await compute.runBatch('models.refit', { values: synthesise(z.seed, z.peakMw, hours), excluded: [], horizon, inService: null, backtestDays: 7 });
      if (!r.forecast.mean.every((v) => Number.isFinite(v) && v >= 0)) throw new Error(`zone ${z.seed}: a forecast value is not a load`);
      done++;
      onDone?.(done, performance.now() - t0);
    }),
  );
  return (performance.now() - t0) / 1000;
}

async function main(): Promise<void> {
  const compute = new ComputeService();
  try {
    console.log(`refit benchmark: the nightly batch pool of ${compute.batchSize} worker thread(s) (interactive pool: ${compute.size}), engine only (histories synthesised in memory, no database)\n`);
    // warm the threads (module load, JIT) so the first case is not charged for it
    await refitAll(compute, [{ seed: 999, peakMw: 200 }], 4 * 168);

    const demo = DEMO_ZONES.map((z, i) => ({ seed: i + 1, peakMw: z.peakMw }));
    const demoS = await refitAll(compute, demo, 8 * 168);
    console.log(`demo zones (${DEMO_ZONES.map((z) => z.code).join(', ')}): ${demo.length} zones x ${8 * 168} hours in ${demoS.toFixed(1)} s (${((demoS / demo.length) * 1000).toFixed(0)} ms per zone)`);

    console.log('\ngrowth with history length, 20 zones:');
    const twenty = Array.from({ length: 20 }, (_, i) => ({ seed: 100 + i, peakMw: 100 + 10 * i }));
    for (const weeks of [4, 8, 12]) {
      const s = await refitAll(compute, twenty, weeks * 168);
      console.log(`  ${String(weeks).padStart(2)} weeks (${weeks * 168} h): ${s.toFixed(1)} s, ${((s / 20) * 1000).toFixed(0)} ms per zone`);
    }

    console.log('\ngrowth with zones, 8 weeks each (elapsed as zones complete in the 200-zone run):');
    const zones = Array.from({ length: 200 }, (_, i) => ({ seed: 1000 + i, peakMw: 80 + (i % 40) * 8 }));
    const marks = new Set([25, 50, 100, 150, 200]);
    const total = await refitAll(compute, zones, 8 * 168, (done, ms) => {
      if (marks.has(done)) console.log(`  ${String(done).padStart(3)} zones: ${(ms / 1000).toFixed(1)} s`);
    });
    console.log(`refit: ${zones.length} zones x ${8 * 168} hours in ${total.toFixed(1)} s`);
  } finally {
    await compute.onModuleDestroy();
  }
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
