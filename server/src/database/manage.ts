/**
 * Database chores for the start and test scripts:
 *   node dist/database/manage.js migrate   apply pending migrations
 *   node dist/database/manage.js seed      load the demo scenario into an empty database
 *   node dist/database/manage.js feed-key NAME
 *                                          create (or rotate) the meter-feed key NAME; prints only the key
 *   node dist/database/manage.js demo-replay [--zones A,B] [--wait-seconds N]
 *                                          the first start's replay of the desk's daily work over the
 *                                          backfilled history and the demo's published schedules (once;
 *                                          see src/database/demo-replay.command.ts)
 */
import 'reflect-metadata';
import { MikroORM } from '@mikro-orm/mariadb';
import { AuditRepository } from '../audit/audit.repository';
import { AuditService } from '../audit/audit.service';
import { FeedKeysRepository } from '../feeds/feed-keys.repository';
import { FeedKeysService } from '../feeds/feed-keys.service';
import { WeatherRepository } from '../weather/weather.repository';
import { ZonesRepository } from '../zones/zones.repository';
import { demoReplayCommand } from './demo-replay.command';
import { ormConfig } from './mikro-orm.config';
import { DatabaseSeeder } from './seeders/DatabaseSeeder';

export async function migrate(orm: MikroORM): Promise<string[]> {
  const applied = await orm.getMigrator().up();
  return applied.map((m) => m.name);
}

async function main(command: string | undefined): Promise<void> {
  if (command === 'demo-replay') return demoReplayCommand(process.argv.slice(3));
  const orm = await MikroORM.init(ormConfig());
  try {
    if (command === 'migrate') {
      const applied = await migrate(orm);
      console.log(applied.length ? `applied migrations: ${applied.join(', ')}` : 'schema is up to date');
    } else if (command === 'seed') {
      await orm.getSeeder().seed(DatabaseSeeder);
      console.log('demo scenario in place');
    } else if (command === 'feed-key') {
      const name = process.argv[3];
      if (!name) throw new Error('usage: manage feed-key NAME');
      const em = orm.em.fork();
      console.log(await new FeedKeysService(new FeedKeysRepository(em), new ZonesRepository(em), new WeatherRepository(em), new AuditService(new AuditRepository(em))).rotate(name));
    } else {
      throw new Error('usage: manage migrate|seed|feed-key NAME|demo-replay');
    }
  } finally {
    await orm.close(true);
  }
}

if (require.main === module) {
  main(process.argv[2]).catch((error: unknown) => {
    console.error(error instanceof Error ? error.message : error);
    process.exit(1);
  });
}
