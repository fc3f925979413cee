/**
 * The worker process: `node --import tsx worker/src/main.ts`. It connects pg-boss (which creates or upgrades
 * its `pgboss` schema) and waits for jobs; the sweep queues are registered here as they arrive.
 */
import PgBoss from 'pg-boss';
import { createLogger } from '../../api/src/logger.js';
import { loadWorkerConfig } from './config.js';

const config = loadWorkerConfig();
const logger = createLogger(config.logLevel, 'worker');

const boss = new PgBoss({ connectionString: config.databaseUrl, max: 4 });
boss.on('error', (err) => logger.error({ err }, 'pg-boss error'));

let stopping = false;
let started: Promise<unknown> = Promise.resolve();
async function stop(signal: string): Promise<void> {
  if (stopping) return;
  stopping = true;
  logger.info({ signal }, 'stopping');
  await started.catch(() => undefined);
  await boss.stop({ graceful: true, wait: true, timeout: 10_000 });
  logger.info('stopped');
  process.exit(0);
}
// Handlers go in before anything is announced: whoever reads the "waiting" line may signal at once.
process.on('SIGINT', () => void stop('SIGINT'));
process.on('SIGTERM', () => void stop('SIGTERM'));

started = boss.start();
await started;
if (!stopping) logger.info('connected to the job queue; waiting for work');
