import { MikroORM } from '@mikro-orm/postgresql';
import { ormConfig } from './orm-config.js';

/** Connects the ORM to the database. */
export async function openOrm(databaseUrl: string, options: { poolMax?: number } = {}): Promise<MikroORM> {
  return MikroORM.init(ormConfig(databaseUrl, options));
}
