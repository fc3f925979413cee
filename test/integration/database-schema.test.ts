import { expect } from 'chai';
import type { MikroORM } from '@mikro-orm/postgresql';
import { openOrm } from '../../api/src/db/open-orm.js';
import { pendingMigrations } from '../../api/src/db/migrate-database.js';
import { testDatabaseUrl } from '../support/test-database.js';

describe('database schema and committed migrations', () => {
  let orm: MikroORM;

  before(async () => {
    orm = await openOrm(testDatabaseUrl(), { poolMax: 2 });
  });
  after(() => orm?.close());

  it('has every committed migration applied by the test setup', async () => {
    expect(await pendingMigrations(orm)).to.deep.equal([]);
  });

  it('matches the entities exactly: no change is missing from the migrations', async () => {
    const missing = await orm.getSchemaGenerator().getUpdateSchemaSQL({ wrap: false });
    expect(missing.trim(), 'run `npm run migration:create -- <name>` and commit the file').to.equal('');
  });

  it('keeps the session table of connect-pg-simple', async () => {
    const rows = await orm.em
      .fork()
      .getConnection()
      .execute<{ column_name: string }[]>(`select column_name from information_schema.columns where table_name = 'session' order by column_name`);
    expect(rows.map((row) => row.column_name)).to.deep.equal(['expire', 'sess', 'sid']);
  });
});
