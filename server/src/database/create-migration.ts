/**
 * Writes a new migration from the difference between the entities and the database
 * (`npm run migration:create -w server`). Review the file, then add it to migrations/index.ts.
 */
import 'reflect-metadata';
import { MikroORM } from '@mikro-orm/mariadb';
import { ormConfig } from './mikro-orm.config';

async function main(): Promise<void> {
  const orm = await MikroORM.init(ormConfig());
  try {
    const migrator = orm.getMigrator();
    await migrator.up();
    const initial = (await migrator.getExecutedMigrations()).length === 0;
    const result = await migrator.createMigration('src/database/migrations', false, initial);
    console.log(result.fileName ? `wrote ${result.fileName}` : 'no schema difference; nothing written');
  } finally {
    await orm.close(true);
  }
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
