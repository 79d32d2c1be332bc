/**
 * The meter-feed simulator's command line (`npm run simulate -- --help`).
 */
import { DEMO_TIME_ZONE, DEMO_ZONES, floorHour, HOUR_MS, WEEK_HOURS } from '@morrowline/shared';
import { FeedGenerator, type SimReading, type SimWeather } from './generator';
import { exportDataSet } from './export';
import { HELP, parseOptions, type SimOptions } from './options';
import { FeedSender } from './sender';

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

export async function run(options: SimOptions, log: (line: string) => void): Promise<void> {
  if (!options.key) throw new Error('A feed key is needed: --key KEY or MORROWLINE_FEED_KEY (an admin creates one under feed keys)');
  const zones = DEMO_ZONES.filter((z) => options.zones.includes(z.code)).map((z) => ({ code: z.code, peakMw: z.peakMw }));
  const currentHour = floorHour(Date.now());
  const liveStart = currentHour - options.lagHours * HOUR_MS;
  const start = liveStart - options.backfillWeeks * WEEK_HOURS * HOUR_MS;
  const generator = new FeedGenerator(zones, start, options.seed, DEMO_TIME_ZONE);
  const sender = new FeedSender(options.url, options.key, `sim${options.seed}-${Date.now().toString(36)}`, log);
  // --quiet leaves out the hour-by-hour lines; the backfill's progress and end are always told
  // (npm start waits for "backfill done").
  const info = (line: string) => options.quiet || log(line);
  let stopping = false;
  const stop = () => {
    stopping = true;
  };
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);

  try {
    if (generator.hour < liveStart) {
      log(`backfilling ${options.backfillWeeks} week(s) for ${zones.map((z) => z.code).join(', ')} from ${new Date(start).toISOString()}`);
      const buffer: SimReading[] = [];
      // Observations ride along with the next forecast (twice a day), so the backfill sends few weather batches.
      const weatherHeld: SimWeather = { observations: [], forecasts: [] };
      let lastReport = Date.now();
      while (generator.hour < liveStart && !stopping) {
        buffer.push(...generator.step());
        while (buffer.length >= options.batch) await sender.send(buffer.splice(0, options.batch));
        const weather = generator.takeWeather();
        if (weather.forecasts.length > 0 || weatherHeld.observations.length >= 24 * 7 * 3) {
          await sender.sendWeather({ observations: [...weatherHeld.observations, ...weather.observations], forecasts: weather.forecasts });
          weatherHeld.observations = [];
        } else {
          weatherHeld.observations.push(...weather.observations);
        }
        if (Date.now() - lastReport > 2000) {
          log(`  … ${new Date(generator.hour).toISOString()} (${sender.stats.stored} stored)`);
          lastReport = Date.now();
        }
      }
      if (options.once) buffer.push(...generator.flush());
      await sender.send(buffer.splice(0));
      await sender.sendWeather(weatherHeld);
      await sender.drain();
      log(`backfill done: ${sender.stats.stored} stored, ${sender.stats.rejected} rejected; weather ${sender.weatherStats.stored} stored, ${sender.weatherStats.rejected} rejected`);
    }

    info(options.once ? 'catching up to now' : `live from ${new Date(generator.hour).toISOString()} at ${options.speed}x`);
    const wall0 = Date.now();
    while (!stopping) {
      const now = Date.now();
      const simulated = options.once ? now : Math.min(now, liveStart + (now - wall0) * options.speed);
      let sent = false;
      while (generator.hour + HOUR_MS <= simulated && !stopping) {
        const hour = generator.hour;
        const readings = generator.step();
        await sender.send(readings);
        await sender.sendWeather(generator.takeWeather());
        sent = true;
        if (!options.once) info(`${new Date(hour).toISOString()}  ${readings.map((r) => `${r.zone} ${r.mw.toFixed(1)}`).join('  ')}`);
      }
      if (options.once) {
        await sender.send(generator.flush());
        break;
      }
      if (!sent) {
        // Wake when the simulated clock (and the wall clock) reach the end of the next hour.
        const end = generator.hour + HOUR_MS;
        const wakeAt = Math.max(wall0 + (end - liveStart) / options.speed, end);
        await sleep(Math.min(1000, Math.max(20, wakeAt - Date.now())));
      }
    }
    await sender.drain();
  } finally {
    sender.close();
    log(`simulator: sent ${sender.stats.sent}, stored ${sender.stats.stored}, rejected ${sender.stats.rejected}, batches resent ${sender.stats.resent}`);
  }
}

if (require.main === module) {
  let options: SimOptions;
  try {
    options = parseOptions(process.argv.slice(2));
  } catch (error) {
    console.error(`${(error as Error).message}\n\n${HELP}`);
    process.exit(2);
  }
  if (options.help) {
    console.log(HELP);
    process.exit(0);
  }
  if (options.export) {
    const summary = exportDataSet({ ...options.export, seed: options.seed });
    console.log(`wrote ${summary.hours} hours and ${summary.vintages} forecast vintages of ${options.export.zone}: ${summary.files.join(', ')}`);
    process.exit(0);
  }
  run(options, (line) => console.log(line))
    .then(() => process.exit(0))
    .catch((error: unknown) => {
      console.error(error instanceof Error ? error.message : error);
      process.exit(1);
    });
}
