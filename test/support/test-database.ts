import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { startCluster, stopCluster } from '../../ops/pg-cluster.js';
import { ensurePostgresBin } from '../../ops/postgres-binaries.js';

/** Where the test run's database URL travels from the global setup to the test files (and child processes). */
export const testDatabaseUrlVariable = 'CONSERVA_TEST_DATABASE_URL';
const folderPrefix = 'conserva-test-db-';
const firstTestPort = 55433;

/** The throwaway test database of this run. Call it inside tests or hooks, not at import time. */
export function testDatabaseUrl(): string {
  const url = process.env[testDatabaseUrlVariable];
  if (!url) {
    throw new Error(
      `No test database: ${testDatabaseUrlVariable} is not set. Run the tests with \`npm test\` or ` +
        '`npx mocha <files>` from the project root, whose .mocharc.json starts a throwaway cluster.',
    );
  }
  return url;
}

export interface TestDatabase {
  url: string;
  stop(): void;
}

function portIsFree(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const probe = createServer();
    probe.once('error', () => resolve(false));
    probe.listen(port, '127.0.0.1', () => probe.close(() => resolve(true)));
  });
}

/** A free loopback port from `from` upwards, so test runs never clash with npm start (55432) or each other. */
export async function freePort(from: number): Promise<number> {
  for (let port = from; port < firstTestPort + 500; port++) {
    if (await portIsFree(port)) return port;
  }
  throw new Error(`No free port between ${from} and ${firstTestPort + 499} for the test database.`);
}

function processAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/** Stops and removes clusters left behind by test runs that were killed before their teardown. */
function removeAbandonedClusters(bin: string): void {
  for (const name of readdirSync(tmpdir()).filter((entry) => entry.startsWith(folderPrefix))) {
    const dir = path.join(tmpdir(), name);
    const ownerFile = path.join(dir, 'owner.pid');
    const owner = existsSync(ownerFile) ? Number(readFileSync(ownerFile, 'utf8')) : NaN;
    if (Number.isInteger(owner) && processAlive(owner)) continue;
    try {
      stopCluster({ dir, bin }, 'immediate');
    } catch {
      // A half-created folder has nothing to stop; remove it anyway.
    }
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Another run may take the port between the probe and the server's bind; then the next port is tried. */
async function startOnFreePort(dir: string, bin: string) {
  const fixed = process.env.CONSERVA_TEST_DB_PORT;
  let port = fixed ? Number(fixed) : await freePort(firstTestPort);
  for (let attempt = 1; ; attempt++) {
    try {
      return await startCluster({ dir, bin, port, database: 'conserva_test', role: 'conserva', throwaway: true });
    } catch (error) {
      const portTaken = /could not bind|Address already in use/.test(String((error as Error).message));
      if (fixed || !portTaken || attempt >= 5) throw error;
      port = await freePort(port + 1);
    }
  }
}

/**
 * Starts a throwaway cluster in a fresh folder under the system temp folder (fsync off), on loopback, and
 * returns its URL. stop() removes it again; it is also removed when this process exits.
 */
export async function startTestDatabase(): Promise<TestDatabase> {
  const bin = ensurePostgresBin((line) => console.error(line));
  removeAbandonedClusters(bin);
  const dir = mkdtempSync(path.join(tmpdir(), folderPrefix));
  writeFileSync(path.join(dir, 'owner.pid'), String(process.pid));
  let stopped = false;
  const stop = () => {
    if (stopped) return;
    stopped = true;
    try {
      stopCluster({ dir, bin }, 'immediate');
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  };
  process.once('exit', stop);
  try {
    const cluster = await startOnFreePort(dir, bin);
    return { url: cluster.url, stop };
  } catch (error) {
    stop();
    throw error;
  }
}

/** host:port/database of a URL, without the password (for messages). */
export function describeCluster(url: string): string {
  const { hostname, port, pathname } = new URL(url);
  return `${hostname}:${port}${pathname}`;
}

