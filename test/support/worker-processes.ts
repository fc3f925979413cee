import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { createInterface } from 'node:readline';
import { testDatabaseUrl } from './test-database.js';

const root = path.resolve(import.meta.dirname, '../..');

export interface TestWorkerOptions {
  /** Shown in shard records (CONSERVA_WORKER_NAME); default test-worker-<n>. */
  name?: string;
  threads?: number;
  /** Fixed subsets per shard (CONSERVA_SHARD_SUBSETS). */
  shardSubsets?: number;
  /** pg-boss expiry of shard jobs in seconds (default 30). */
  expireSeconds?: number;
  /** pg-boss maintenance interval in seconds (default 1, so lost jobs come back quickly). */
  maintenanceSeconds?: number;
  /** SMTP server for the sweep e-mails (default none: CONSERVA_SMTP_URL=off). */
  smtpUrl?: string;
  env?: NodeJS.ProcessEnv;
}

export interface TestWorker {
  name: string;
  child: ChildProcess;
  /** The worker's log lines so far (JSON), for failure messages. */
  log: string[];
  /** SIGTERM, then wait for the exit. */
  stop(): Promise<void>;
  /** SIGKILL, as a crash would end it; resolves when it is gone. */
  kill(): Promise<void>;
}

let counter = 0;

/** Spawns worker/src/main.ts under tsx against the test database and waits until it takes jobs. */
export async function startTestWorker(options: TestWorkerOptions = {}): Promise<TestWorker> {
  const name = options.name ?? `test-worker-${process.pid}-${++counter}`;
  const child = spawn(process.execPath, ['--import', 'tsx', 'worker/src/main.ts'], {
    cwd: root,
    env: {
      ...process.env,
      DATABASE_URL: testDatabaseUrl(),
      CONSERVA_LOG_LEVEL: 'info',
      CONSERVA_WORKER_NAME: name,
      CONSERVA_WORKER_THREADS: String(options.threads ?? 1),
      CONSERVA_SHARD_EXPIRE_SECONDS: String(options.expireSeconds ?? 30),
      CONSERVA_QUEUE_MAINTENANCE_SECONDS: String(options.maintenanceSeconds ?? 1),
      CONSERVA_SMTP_URL: options.smtpUrl ?? 'off',
      CONSERVA_PUBLIC_URL: 'http://conserva.test/',
      ...(options.shardSubsets ? { CONSERVA_SHARD_SUBSETS: String(options.shardSubsets) } : {}),
      ...options.env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const log: string[] = [];
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  const ready = new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`worker ${name} did not start within 60 s:\n${log.join('\n')}`)), 60_000);
    createInterface({ input: child.stdout! }).on('line', (line) => {
      log.push(line);
      if (process.env.CONSERVA_TEST_WORKER_LOG) console.log(`[${name}] ${line}`);
      if (line.includes('waiting for work')) {
        clearTimeout(timer);
        resolve();
      }
    });
    createInterface({ input: child.stderr! }).on('line', (line) => log.push(line));
    void exited.then(() => {
      clearTimeout(timer);
      reject(new Error(`worker ${name} exited before it was ready:\n${log.join('\n')}`));
    });
  });
  await ready;
  return {
    name,
    child,
    log,
    async stop() {
      if (child.exitCode !== null || child.signalCode !== null) return;
      child.kill('SIGTERM');
      const forced = setTimeout(() => child.kill('SIGKILL'), 20_000);
      await exited;
      clearTimeout(forced);
    },
    async kill() {
      if (child.exitCode !== null || child.signalCode !== null) return;
      child.kill('SIGKILL');
      await exited;
    },
  };
}

/** Polls until the check returns a value other than undefined, or fails after timeoutMs. */
export async function eventually<T>(what: string, check: () => Promise<T | undefined>, timeoutMs = 60_000, intervalMs = 100): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const value = await check();
    if (value !== undefined) return value;
    if (Date.now() > until) throw new Error(`timed out after ${timeoutMs} ms waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, intervalMs));
  }
}
