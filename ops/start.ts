/**
 * `npm start`: builds the web app when needed, starts the database (private cluster unless DATABASE_URL is
 * set), applies migrations, seeds the demo once (development only: teams, projects, recordings, candidate
 * sets and a first sweep per demo project), starts the local mailbox (development, unless CONSERVA_SMTP_URL
 * names a server), the API and one worker, prints the URL, and on Ctrl-C stops everything it started.
 */
import { allowanceDefaultsFrom } from '../api/src/config.js';
import { openOrm } from '../api/src/db/open-orm.js';
import { seedDemoWork } from '../api/src/demo/seed-demo-work.js';
import { createLogger } from '../api/src/logger.js';
import { QueueClient } from '../api/src/queue/queue-client.js';
import { seedDemo } from '../api/src/db/seed-demo.js';
import type { DemoAccount } from '../api/src/db/demo-scenario.js';
import { applyMigrationsAt } from './apply-migrations.js';
import { projectRoot, startDevDatabase, stopDevDatabase } from './dev-database.js';
import { formatLogLine } from './log-line-format.js';
import { startService, stopService, type ServiceProcess } from './service-process.js';
import { developmentSessionSecret } from './session-secret.js';
import { buildWebIfStale } from './web-build.js';

const log = (line: string) => console.log(formatLogLine('start', line));
const production = process.env.NODE_ENV === 'production';
const host = process.env.CONSERVA_HOST || '127.0.0.1';
const port = Number(process.env.CONSERVA_PORT || 8470);
const demoWanted = (process.env.CONSERVA_DEMO ?? (production ? 'off' : 'on')) !== 'off';

const services: ServiceProcess[] = [];
let stopDatabaseAtExit = false;
let shutdown: Promise<never> | null = null;

/**
 * Stops the children, then the database if this run started it, then exits. Ctrl-C often arrives twice (once
 * from the terminal, once relayed by tsx); later calls wait for the first shutdown instead of cutting it short.
 */
function shutDown(code: number): Promise<never> {
  shutdown ??= (async () => {
    await Promise.all(services.map((service) => stopService(service)));
    if (stopDatabaseAtExit && stopDevDatabase()) log('PostgreSQL stopped.');
    log('Stopped.');
    process.exit(code);
  })();
  return shutdown;
}

async function seedDemoData(databaseUrl: string): Promise<DemoAccount[]> {
  const orm = await openOrm(databaseUrl, { poolMax: 2 });
  const queue = new QueueClient(databaseUrl, createLogger('warn', 'start'));
  try {
    const result = await seedDemo(orm);
    log(result.seededNow ? 'Demo data seeded.' : 'Demo data was seeded before; left as it is.');
    const launched = await seedDemoWork(orm, await queue.get(), allowanceDefaultsFrom(process.env));
    if (launched > 0) log(`Demo recordings and candidate sets seeded; ${launched} demo sweep(s) queued for the worker.`);
    return result.accounts;
  } finally {
    await queue.close();
    await orm.close();
  }
}

async function waitUntilHealthy(url: string, timeoutMs: number): Promise<boolean> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until && !shutdown) {
    if (services.some((service) => service.child.exitCode !== null)) return false;
    try {
      if ((await fetch(`${url}api/health`)).ok) return true;
    } catch {
      // not listening yet
    }
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  return false;
}

function printBanner(url: string, accounts: DemoAccount[]): void {
  const lines = ['', `  Conserva is running at ${url}`];
  if (!production && accounts.length) {
    lines.push('', '  Demo accounts (development only):');
    for (const account of accounts) {
      lines.push(`    ${account.role.padEnd(8)} ${account.email.padEnd(36)} password: ${account.password.padEnd(22)} (${account.team})`);
    }
  }
  lines.push('', '  Press Ctrl-C to stop.', '');
  console.log(lines.join('\n'));
}

process.on('SIGINT', () => void shutDown(0));
process.on('SIGTERM', () => void shutDown(0));

async function main(): Promise<void> {
  log(`Starting Conserva (${production ? 'production' : 'development'}).`);
  if (production && (process.env.CONSERVA_SESSION_SECRET ?? '').length < 32) {
    log('NODE_ENV=production needs CONSERVA_SESSION_SECRET (at least 32 random characters).');
    await shutDown(1);
  }
  if (!(await buildWebIfStale(projectRoot, log))) await shutDown(1);
  const database = await startDevDatabase(log);
  stopDatabaseAtExit = database.startedNow;
  if (database.external) log('Using the PostgreSQL server named by DATABASE_URL.');
  await applyMigrationsAt(database.url, log);
  const accounts = demoWanted ? await seedDemoData(database.url) : [];

  const env: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: process.env.NODE_ENV || 'development',
    DATABASE_URL: database.url,
    CONSERVA_SESSION_SECRET: production ? process.env.CONSERVA_SESSION_SECRET : developmentSessionSecret(projectRoot),
  };
  if (!production && !process.env.CONSERVA_SMTP_URL) {
    services.push(startService('mailbox', 'ops/mailbox.ts', projectRoot, env));
  }
  services.push(startService('api', 'api/src/main.ts', projectRoot, env));
  services.push(startService('worker', 'worker/src/main.ts', projectRoot, env));
  for (const service of services) {
    void service.exited.then((code) => {
      if (shutdown) return;
      log(`The ${service.name} process ended unexpectedly (${code}); stopping the rest.`);
      void shutDown(1);
    });
  }

  const shownHost = host === '0.0.0.0' || host === '::' ? 'localhost' : host.includes(':') ? `[${host}]` : host;
  const url = `http://${shownHost}:${port}/`;
  if (!(await waitUntilHealthy(url, 60_000))) {
    log(`The API did not become healthy at ${url}api/health within a minute.`);
    await shutDown(1);
  }
  printBanner(url, accounts);
}

main().catch((error: unknown) => {
  log(`Start failed: ${error instanceof Error ? error.message : String(error)}`);
  void shutDown(1);
});
