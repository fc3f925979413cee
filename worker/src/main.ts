/**
 * The worker process: `node --import tsx worker/src/main.ts`. It connects pg-boss, creates the sweep queues,
 * and takes jobs: prepare, shards (one per pool thread at a time), finish, the launcher's e-mail, and failed
 * jobs. Any number of workers on any number of machines can share one database.
 */
import PgBoss from 'pg-boss';
import { createLogger } from '../../api/src/logger.js';
import { openOrm } from '../../api/src/db/open-orm.js';
import { SweepMailer } from '../../api/src/mail/sweep-mailer.js';
import {
  createSweepQueues,
  deadLetterJobSchema,
  endedJobSchema,
  finishJobSchema,
  prepareJobSchema,
  shardJobSchema,
  sweepQueueNames,
} from '../../api/src/queue/sweep-jobs.js';
import type * as z from 'zod';
import { loadWorkerConfig } from './config.js';
import { runDeadLetterJob } from './jobs/dead-letter-job.js';
import { runEndedJob } from './jobs/ended-job.js';
import { runFinishJob } from './jobs/finish-job.js';
import type { JobContext } from './jobs/job-context.js';
import { runPrepareJob } from './jobs/prepare-job.js';
import { runShardJob } from './jobs/shard-job.js';
import { SweepPool } from './pool/sweep-pool.js';
import { SweepStepPool } from './pool/sweep-step-pool.js';
import { startPresenceHeartbeat } from './worker-presence-heartbeat.js';

const config = loadWorkerConfig();
const logger = createLogger(config.logLevel, 'worker');

const boss = new PgBoss({
  connectionString: config.databaseUrl,
  max: Math.max(4, config.threads + 2),
  maintenanceIntervalSeconds: config.maintenanceSeconds,
  schedule: false,
});
boss.on('error', (err) => logger.error({ err }, 'pg-boss error'));

let stopping = false;
let context: JobContext | null = null;
let stopPresence: (() => Promise<void>) | null = null;
let started: Promise<unknown> = Promise.resolve();

async function stop(signal: string): Promise<void> {
  if (stopping) return;
  stopping = true;
  logger.info({ signal }, 'stopping');
  await started.catch(() => undefined);
  for (const stopShard of context?.runningShards ?? []) stopShard();
  await boss.stop({ graceful: true, wait: true, timeout: 10_000 });
  await stopPresence?.();
  await context?.pool.destroy();
  await context?.steps.destroy();
  context?.mailer.close();
  await context?.orm.close();
  logger.info('stopped');
  process.exit(0);
}
// Handlers go in before anything is announced: whoever reads the "waiting" line may signal at once.
process.on('SIGINT', () => void stop('SIGINT'));
process.on('SIGTERM', () => void stop('SIGTERM'));

/** Registers `count` concurrent consumers of a queue; each payload is checked against its schema first. */
async function consume<S extends z.ZodType>(
  queue: string,
  schema: S,
  count: number,
  pollingIntervalSeconds: number,
  handle: (ctx: JobContext, job: z.output<S>) => Promise<void>,
): Promise<void> {
  for (let i = 0; i < count; i++) {
    await boss.work(queue, { pollingIntervalSeconds, batchSize: 1 }, async ([job]) => {
      if (!job || !context) return;
      const payload = schema.safeParse(job.data);
      if (!payload.success) {
        logger.error({ queue, jobId: job.id, issues: payload.error.issues }, 'job payload refused; the job is dropped');
        return;
      }
      await handle(context, payload.data);
    });
  }
}

async function main(): Promise<void> {
  await boss.start();
  await createSweepQueues(boss);
  const orm = await openOrm(config.databaseUrl, { poolMax: config.threads + 4 });
  context = {
    orm,
    boss,
    pool: new SweepPool({ threads: config.threads }),
    steps: new SweepStepPool(),
    config,
    logger,
    mailer: new SweepMailer(config.smtpUrl, config.mailFrom, logger),
    runningShards: new Set(),
  };
  stopPresence = startPresenceHeartbeat(orm, config, logger);
  await consume(sweepQueueNames.shard, shardJobSchema, config.threads, 0.5, (ctx, job) => runShardJob(ctx, job));
  await consume(sweepQueueNames.prepare, prepareJobSchema, 1, 0.5, runPrepareJob);
  await consume(sweepQueueNames.finish, finishJobSchema, 1, 0.5, runFinishJob);
  await consume(sweepQueueNames.ended, endedJobSchema, 1, 1, runEndedJob);
  await consume(sweepQueueNames.deadLetter, deadLetterJobSchema, 1, 1, runDeadLetterJob);
}

started = main();
await started;
if (!stopping) logger.info({ worker: config.name, threads: config.threads }, 'connected to the job queue; waiting for work');
