import { migrateDatabase } from '../api/src/db/migrate-database.js';

/** Applies pending migrations and says which ran. */
export async function applyMigrationsAt(databaseUrl: string, log: (line: string) => void): Promise<void> {
  const applied = await migrateDatabase(databaseUrl);
  log(applied.length ? `Applied migrations: ${applied.join(', ')}` : 'Database schema is up to date.');
}
