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
      // No snapshot file: migration:create diffs the entities against the database it has just migrated, the
      // way the schema check in the tests does. The snapshot MikroORM writes after migrating is read from that
      // database without `skipTables`, so it held the session table and every new migration dropped it.
      snapshot: false,
      silent: true,
    },
    // connect-pg-simple owns this table; without the skip the schema diff would drop it.
    schemaGenerator: { skipTables: ['session'] },
    discovery: { warnWhenNoEntities: true },
  });
}
