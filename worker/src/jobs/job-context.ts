import type { MikroORM } from '@mikro-orm/postgresql';
import type PgBoss from 'pg-boss';
import type { Logger } from 'pino';
import type { SweepMailer } from '../../../api/src/mail/sweep-mailer.js';
import type { WorkerConfig } from '../config.js';
import type { SweepPool } from '../pool/sweep-pool.js';
import type { SweepStepPool } from '../pool/sweep-step-pool.js';

/** What every job handler of this worker shares. */
export interface JobContext {
  orm: MikroORM;
  boss: PgBoss;
  pool: SweepPool;
  /** The prepare and finish steps, on a thread of their own. */
  steps: SweepStepPool;
  config: WorkerConfig;
  logger: Logger;
  mailer: SweepMailer;
  /** Stops of the shards running now; shutdown calls them so their jobs are handed out again at once. */
  runningShards: Set<() => void>;
}
