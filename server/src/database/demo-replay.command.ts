/**
 * `node dist/database/manage.js demo-replay [--zones A,B] [--wait-seconds N]`: the first start's
 * replay (DemoReplayService), run by scripts/start.sh beside the running server against the same
 * database (from source: `npx tsx src/database/manage.ts demo-replay`). It builds only what the
 * replay needs from the ORM, by hand rather than through Nest's injector, so it runs from the
 * TypeScript source too (tsx emits no decorator metadata): no HTTP, no sockets, no refit
 * schedule, no start-up recovery of the server's refit jobs. It first waits, up to N seconds
 * (default 180), for the meter feeds to reach the present, since a day is replayed only from
 * readings already stored. Prints a short line per step; once done, later calls print one line
 * and change nothing.
 */
import { MikroORM } from '@mikro-orm/mariadb';
import { Logger } from '@nestjs/common';
import { EventEmitter2 } from '@nestjs/event-emitter';
import { parseArgs } from 'node:util';
import { AlertsRepository } from '../alerts/alerts.repository';
import { AlertsService } from '../alerts/alerts.service';
import { ScheduleInForce } from '../accuracy/schedule-in-force';
import { AuditRepository } from '../audit/audit.repository';
import { AuditService } from '../audit/audit.service';
import { ComputeService } from '../compute/compute.service';
import { loadConfig } from '../config/configuration';
import { ormConfig } from './mikro-orm.config';
import { DomainEventsPublisher } from '../events/domain-events.publisher';
import { ForecastRunsRepository } from '../forecasts/forecast-runs.repository';
import { ForecastsService } from '../forecasts/forecasts.service';
import { CommittedLoadService } from '../live/committed-load.service';
import { loadRefitSchedule } from '../models/refit-schedule';
import { OutagesRepository } from '../outages/outages.repository';
import { OutagesService } from '../outages/outages.service';
import { ReadingsRepository } from '../readings/readings.repository';
import { ReadingsService } from '../readings/readings.service';
import { ScheduleMailer } from '../schedules/schedule-mailer';
import { ScheduleNotifier } from '../schedules/schedule-notifier';
import { ScheduleRevisionsRepository } from '../schedules/schedule-revisions.repository';
import { SchedulesService } from '../schedules/schedules.service';
import { ZonesRepository } from '../zones/zones.repository';
import { DemoReplayService, type DemoReplayOptions, type DemoReplayOutcome } from '../replay/demo-replay.service';
import { DemoSchedulesService } from '../replay/demo-schedules.service';
import { ForecastReplayService } from '../replay/forecast-replay.service';

/**
 * Desks are connected to the server, not to this process: the events the services publish here
 * have no listener, and desks read what changed on their next query.
 */
const unheardEvents = () => new DomainEventsPublisher(new EventEmitter2());

export interface DemoReplayParts {
  replay: DemoReplayService;
  forecasts: ForecastReplayService;
  readings: ReadingsService;
  alerts: AlertsService;
  close(): Promise<void>;
}

/** The replay's services on an ORM of their own (the composition the server's modules would make). */
export async function openDemoReplay(): Promise<DemoReplayParts> {
  const config = loadConfig();
  const orm = await MikroORM.init(ormConfig(config));
  const em = orm.em;
  const schedule = loadRefitSchedule();
  const events = unheardEvents();
  const audit = new AuditService(new AuditRepository(em));
  const compute = new ComputeService();
  const zones = new ZonesRepository(em);
  const repository = new ReadingsRepository(em);
  const readings = new ReadingsService(zones, repository, events);
  const outages = new OutagesService(new OutagesRepository(em), audit);
  const forecasts = new ForecastsService(new ForecastRunsRepository(em), zones, readings, outages, events);
  const revisions = new ScheduleRevisionsRepository(em);
  const schedules = new SchedulesService(revisions, zones, audit, events, forecasts, new ScheduleNotifier(em, audit, new ScheduleMailer()));
  const committed = new CommittedLoadService(zones, new ForecastRunsRepository(em), new ScheduleInForce(revisions));
  const alerts = new AlertsService(new AlertsRepository(em), zones, readings, audit, events, committed);
  const forecastReplay = new ForecastReplayService(em, repository, outages, forecasts, compute, audit, {
    updateMinute: schedule.updateMinute,
    nightly: schedule.nightly,
    deskTimeZone: config.shifts.timeZone,
  });
  const demoSchedules = new DemoSchedulesService(em, schedules, forecasts, repository, schedule.updateMinute);
  return {
    replay: new DemoReplayService(em, audit, forecastReplay, demoSchedules),
    forecasts: forecastReplay,
    readings,
    alerts,
    close: async () => {
      await compute.onModuleDestroy();
      await orm.close(true);
    },
  };
}

export interface DemoReplayCommandOptions extends DemoReplayOptions {
  /** How long to wait for the feeds to reach the present before replaying what is there. */
  waitSeconds?: number;
}

/**
 * Feeds count as current when their latest hour is the last complete one: a day is replayed only
 * once the readings up to its forecast update are stored, and the simulator's fast replay of the
 * last two days reaches the present within a minute of its backfill.
 */
const CURRENT_HOURS = 0;
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

export async function runDemoReplay(options: DemoReplayCommandOptions = {}): Promise<DemoReplayOutcome> {
  const log = options.log ?? ((line: string) => console.log(line));
  const parts = await openDemoReplay();
  try {
    const at = await parts.replay.doneAt();
    if (at) return { state: 'done-before', at };
    await waitForFeeds(parts.readings, options.zones, options.waitSeconds ?? 180, log);
    const outcome = await parts.replay.run({ ...options, log });
    if (outcome.state === 'done') {
      // the readings of the last two days arrived before the day-ahead numbers they are judged
      // against: now that those exist, look at those hours again (alerts the desk reads on its
      // next query; the server's own desks are not connected to this process)
      log('checking the last two days against the replayed day-ahead forecasts and schedules for deviation alerts');
      await parts.alerts.reviewRecent(options.zones);
      await parts.alerts.settled();
    }
    return outcome;
  } finally {
    await parts.close();
  }
}

async function waitForFeeds(readings: ReadingsService, zones: readonly string[] | undefined, seconds: number, log: (line: string) => void): Promise<void> {
  const deadline = Date.now() + seconds * 1000;
  let said = 0;
  for (;;) {
    const behind = (await readings.status()).filter((s) => (!zones || zones.includes(s.zone)) && s.lastHour !== null && (s.hoursBehind ?? 0) > CURRENT_HOURS);
    // (a zone without any reading has nothing to wait for: it is simply not replayed)
    if (behind.length === 0) return;
    if (Date.now() >= deadline) {
      log(`feeds still behind (${behind.map((s) => `${s.zone} ${s.hoursBehind} h`).join(', ')}); replaying what is stored`);
      return;
    }
    if (Date.now() - said >= 10_000) {
      log(`waiting for the meter feeds to reach the present (${behind.map((s) => `${s.zone} ${s.hoursBehind} h behind`).join(', ')})`);
      said = Date.now();
    }
    await sleep(2000);
  }
}

/** The command line: parses its arguments, runs, and says in one line when there was nothing to do. */
export async function demoReplayCommand(argv: readonly string[]): Promise<void> {
  const { values } = parseArgs({ args: [...argv], options: { zones: { type: 'string' }, 'wait-seconds': { type: 'string' } } });
  const wait = values['wait-seconds'] === undefined ? 180 : Number(values['wait-seconds']);
  if (!/^\d+$/.test(values['wait-seconds'] ?? '0') || !Number.isSafeInteger(wait)) throw new Error(`--wait-seconds must be a whole number of seconds, got "${values['wait-seconds']}"`);
  const zones = values.zones?.split(',').map((z) => z.trim()).filter(Boolean);
  if (zones && zones.length === 0) throw new Error('--zones needs at least one zone code, e.g. --zones MILLRACE,HARROW');
  // the services' own log lines (pool sizes, mail failures) only when something is wrong
  Logger.overrideLogger(['error', 'warn']);
  const started = Date.now();
  const outcome = await runDemoReplay({ zones, waitSeconds: wait });
  if (outcome.state === 'done-before') console.log(`demo replay: already done (${outcome.at}); nothing to do`);
  else if (outcome.state === 'nothing-to-replay') console.log('demo replay: no zone has three weeks of readings yet; nothing replayed (a later start tries again)');
  else {
    const runs = outcome.forecasts.reduce((n, z) => n + z.stored, 0);
    const published = outcome.schedules.filter((s) => s.revisionId !== null).length;
    console.log(`demo replay: done in ${Math.round((Date.now() - started) / 1000)} s: ${runs} replayed forecast runs, ${published} published demo schedules`);
  }
}
