/**
 * Mocha global fixtures (loaded by the root .mocharc.json): one throwaway PostgreSQL cluster per test run,
 * migrated, its URL in CONSERVA_TEST_DATABASE_URL (read it with testDatabaseUrl()). Runs that load only
 * unit tests skip it. With CONSERVA_TEST_DATABASE_URL already set, that database is migrated and used instead.
 */
import path from 'node:path';
import type { Runner, Suite } from 'mocha';
import { migrateDatabase } from '../../api/src/db/migrate-database.js';
import { describeCluster, startTestDatabase, testDatabaseUrlVariable, type TestDatabase } from './test-database.js';

let database: TestDatabase | undefined;

function filesOf(suite: Suite): string[] {
  return [...suite.tests.map((test) => test.file), ...suite.suites.flatMap(filesOf), suite.file].filter((file): file is string => !!file);
}

/** Unit tests need no database; in parallel mode no files are known here, so the cluster is started anyway. */
function needsDatabase(runner: Runner | undefined): boolean {
  const files = runner?.suite ? filesOf(runner.suite) : [];
  const unitDir = `${path.sep}test${path.sep}unit${path.sep}`;
  return files.length === 0 || files.some((file) => !file.includes(unitDir));
}

export async function mochaGlobalSetup(this: Runner): Promise<void> {
  if (!needsDatabase(this)) return;
  if (!process.env[testDatabaseUrlVariable]) {
    const started = Date.now();
    database = await startTestDatabase();
    process.env[testDatabaseUrlVariable] = database.url;
    console.log(`  test database on ${describeCluster(database.url)} (started in ${Date.now() - started} ms)`);
  }
  await migrateDatabase(process.env[testDatabaseUrlVariable]!);
}

export function mochaGlobalTeardown(): void {
  database?.stop();
  database = undefined;
}
