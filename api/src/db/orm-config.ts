import { fileURLToPath } from 'node:url';
import { Migrator } from '@mikro-orm/migrations';
import { defineConfig, type Options } from '@mikro-orm/postgresql';
import { allEntities } from '../entities/all-entities.js';

const migrationsDir = fileURLToPath(new URL('./migrations', import.meta.url));

/** MikroORM settings shared by the API, the worker, the migration scripts and the tests. */
export function ormConfig(databaseUrl: string, options: { poolMax?: number } = {}): Options {
  return defineConfig({
    clientUrl: databaseUrl,
    entities: allEntities,
    extensions: [Migrator],
    // Everything runs under tsx; the migrations are TypeScript files.
    preferTs: true,
    pool: { min: 0, max: options.poolMax ?? 10 },
    migrations: {
      path: migrationsDir,
      pathTs: migrationsDir,
      transactional: true,
      allOrNothing: true,
      snapshotName: '.snapshot-conserva',
      silent: true,
    },
    // connect-pg-simple owns this table; without the skip the schema diff would drop it.
    schemaGenerator: { skipTables: ['session'] },
    discovery: { warnWhenNoEntities: true },
  });
}
