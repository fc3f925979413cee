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
await boss.start();
logger.info('connected to the job queue; waiting for work');

let stopping = false;
async function stop(signal: string): Promise<void> {
  if (stopping) return;
  stopping = true;
  logger.info({ signal }, 'stopping');
  await boss.stop({ graceful: true, wait: true, timeout: 10_000 });
  logger.info('stopped');
  process.exit(0);
}
process.on('SIGINT', () => void stop('SIGINT'));
process.on('SIGTERM', () => void stop('SIGTERM'));
