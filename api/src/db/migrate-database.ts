import { openOrm } from './open-orm.js';
import type { MikroORM } from '@mikro-orm/postgresql';

/** Applies the pending committed migrations; returns the names of those it applied. */
export async function applyMigrations(orm: MikroORM): Promise<string[]> {
  const applied = await orm.getMigrator().up();
  return applied.map((migration) => migration.name);
}

/** Opens a short-lived connection, migrates and closes it again. */
export async function migrateDatabase(databaseUrl: string): Promise<string[]> {
  const orm = await openOrm(databaseUrl, { poolMax: 2 });
  try {
    return await applyMigrations(orm);
  } finally {
    await orm.close();
  }
}

/** Names of committed migrations not yet applied to the database. */
export async function pendingMigrations(orm: MikroORM): Promise<string[]> {
  return (await orm.getMigrator().getPendingMigrations()).map((migration) => migration.name);
}
