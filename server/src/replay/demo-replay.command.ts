/**
 * `node dist/database/manage.js demo-replay [--zones A,B] [--wait-seconds N]`: the first start's
 * replay (DemoReplayService), run by scripts/start.sh beside the running server against the same
 * database. It boots only what the replay needs (no HTTP, no sockets, no refit schedule, no
 * start-up recovery of the server's refit jobs) and waits first, up to N seconds (default 180),
 * for the meter feeds to reach the present, since a day is replayed only from readings already
 * stored. Prints a short line per step; once done, later calls print one line and change nothing.
 */
import { MariaDbDriver } from '@mikro-orm/mariadb';
import { MikroOrmModule } from '@mikro-orm/nestjs';
import { Global, Module } from '@nestjs/common';
import { ConfigModule, ConfigService } from '@nestjs/config';
import { NestFactory } from '@nestjs/core';
import { parseArgs } from 'node:util';
import { AuditModule } from '../audit/audit.module';
import { configFactory, type AppConfig } from '../config/configuration';
import { ormConfig } from '../database/mikro-orm.config';
import { DeskGateway } from '../desk/desk.gateway';
import { ReadingsService } from '../readings/readings.service';
import { DemoReplayService, type DemoReplayOptions, type DemoReplayOutcome } from './demo-replay.service';
import { ReplayModule } from './replay.module';

/** Desks are connected to the server, not to this process: what it would push, they read on their next query. */
class UnconnectedDeskGateway {
  broadcast(): void {}
}

@Global()
@Module({ providers: [{ provide: DeskGateway, useClass: UnconnectedDeskGateway }], exports: [DeskGateway] })
class UnconnectedDeskModule {}

@Module({
  imports: [
    ConfigModule.forRoot({ isGlobal: true, ignoreEnvFile: true, load: [configFactory] }),
    MikroOrmModule.forRootAsync({
      inject: [ConfigService],
      driver: MariaDbDriver,
      useFactory: (config: ConfigService) => ormConfig(config.getOrThrow<AppConfig>('app')),
    }),
    AuditModule,
    UnconnectedDeskModule,
    ReplayModule,
  ],
})
export class DemoReplayCommandModule {}

export interface DemoReplayCommandOptions extends DemoReplayOptions {
  /** How long to wait for the feeds to reach the present before replaying what is there. */
  waitSeconds?: number;
}

/** Feeds count as current when their latest hour is at most this far behind. */
const CURRENT_HOURS = 2;
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

export async function runDemoReplay(options: DemoReplayCommandOptions = {}): Promise<DemoReplayOutcome> {
  const log = options.log ?? ((line: string) => console.log(line));
  const app = await NestFactory.createApplicationContext(DemoReplayCommandModule, { logger: ['error', 'warn'] });
  try {
    const replay = app.get(DemoReplayService);
    const at = await replay.doneAt();
    if (at) return { state: 'done-before', at };
    await waitForFeeds(app.get(ReadingsService), options.zones, options.waitSeconds ?? 180, log);
    return await replay.run({ ...options, log });
  } finally {
    await app.close();
  }
}

async function waitForFeeds(readings: ReadingsService, zones: readonly string[] | undefined, seconds: number, log: (line: string) => void): Promise<void> {
  const deadline = Date.now() + seconds * 1000;
  let said = 0;
  for (;;) {
    const behind = (await readings.status()).filter((s) => (!zones || zones.includes(s.zone)) && s.lastHour !== null && (s.hoursBehind ?? 0) > CURRENT_HOURS);
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
  if (!Number.isInteger(wait) || wait < 0) throw new Error(`--wait-seconds must be a whole number of seconds, got "${values['wait-seconds']}"`);
  const zones = values.zones?.split(',').map((z) => z.trim()).filter(Boolean);
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
