import { defineConfig } from '@mikro-orm/mariadb';
import { Migrator } from '@mikro-orm/migrations';
import { SeedManager } from '@mikro-orm/seeder';
import { loadConfig, type AppConfig } from '../config/configuration';
import { ENTITIES } from './entities';
import { MIGRATIONS } from './migrations';

/**
 * MikroORM settings for MariaDB. Migrations are listed explicitly (not discovered from a
 * folder) so that the compiled server, the tests and the CLI all run the same ones.
 */
export function ormConfig(config: AppConfig = loadConfig()) {
  return defineConfig({
    entities: ENTITIES,
    host: config.db.host,
    port: config.db.port,
    dbName: config.db.name,
    user: config.db.user,
    password: config.db.password,
    debug: config.db.debug,
    timezone: '+00:00',
    forceUtcTimezone: true,
    allowGlobalContext: false,
    extensions: [Migrator, SeedManager],
    migrations: {
      migrationsList: MIGRATIONS,
      path: 'src/database/migrations',
      // MariaDB commits DDL implicitly, so a wrapping transaction would only pretend.
      transactional: false,
      snapshot: false,
      emit: 'ts',
    },
    seeder: { path: 'src/database/seeders', defaultSeeder: 'DatabaseSeeder' },
    pool: { min: 1, max: 10 },
  });
}

export default ormConfig();
