/**
 * `npm run migration:create [-- name]`: compares the entities with the database after the committed migrations
 * and writes a new migration into api/src/db/migrations. Uses DATABASE_URL or the private development cluster,
 * which it migrates first so the diff starts from the committed state (no snapshot file; orm-config.ts says why).
 */
import { startDevDatabase } from '../../../ops/dev-database.js';
import { openOrm } from './open-orm.js';
import { applyMigrations } from './migrate-database.js';

const name = process.argv[2];
const database = await startDevDatabase((line) => console.log(line));
const orm = await openOrm(database.url, { poolMax: 2 });
try {
  await applyMigrations(orm);
  const result = await orm.getMigrator().createMigration(undefined, false, false, name);
  console.log(result.fileName ? `Wrote ${result.fileName}` : 'The entities match the migrations: nothing to write.');
} finally {
  await orm.close();
}
