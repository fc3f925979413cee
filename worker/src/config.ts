import os from 'node:os';
import { integerFrom, mailFromOf, publicUrlFrom, smtpUrlFrom } from '../../api/src/config.js';
import { DEFAULT_SHARD_SECONDS } from '../../shared/sweeps/shard-plan.js';

/** What the worker process reads from its environment (README, Configuration). */
export interface WorkerConfig {
  databaseUrl: string;
  logLevel: string;
  /** How this worker names itself in shard records and the admin view. */
  name: string;
  /** Sweep threads, one shard each at a time. */
  threads: number;
  /** CPU seconds a shard is cut to take. */
  shardSeconds: number;
  /** Fixed subsets per shard instead of shardSeconds (tests). */
  shardSubsets: number | null;
  /** A shard job not finished within this time counts as lost and runs again (pg-boss expiry). */
  shardExpireSeconds: number;
  shardRetries: number;
  /** How often pg-boss looks for expired jobs. */
  maintenanceSeconds: number;
  /** Progress of a running shard is published at least this often. */
  progressMs: number;
  smtpUrl: string | null;
  mailFrom: string;
  publicUrl: string;
}

function numberFrom(env: Record<string, string | undefined>, name: string, fallback: number, min: number): number {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  const value = Number(raw);
  if (!Number.isFinite(value) || value < min) throw new Error(`${name} must be a number of at least ${min}, not "${raw}".`);
  return value;
}

export function loadWorkerConfig(env: Record<string, string | undefined> = process.env): WorkerConfig {
  const databaseUrl = env.DATABASE_URL;
  if (!databaseUrl) throw new Error('DATABASE_URL is not set (npm start sets it for the private cluster).');
  const production = env.NODE_ENV === 'production';
  const shardSeconds = numberFrom(env, 'CONSERVA_SHARD_SECONDS', DEFAULT_SHARD_SECONDS, 0.01);
  const progressMs = integerFrom(env, 'CONSERVA_PROGRESS_MS', 500, 50);
  if (progressMs > 1000) throw new Error('CONSERVA_PROGRESS_MS must be at most 1000: the live view promises progress every second.');
  return {
    databaseUrl,
    logLevel: env.CONSERVA_LOG_LEVEL || 'info',
    name: env.CONSERVA_WORKER_NAME || `${os.hostname()}:${process.pid}`,
    threads: integerFrom(env, 'CONSERVA_WORKER_THREADS', os.availableParallelism(), 1),
    shardSeconds,
    shardSubsets: env.CONSERVA_SHARD_SUBSETS ? integerFrom(env, 'CONSERVA_SHARD_SUBSETS', 0, 1) : null,
    shardExpireSeconds: integerFrom(env, 'CONSERVA_SHARD_EXPIRE_SECONDS', Math.max(300, Math.ceil(shardSeconds * 10)), 2),
    shardRetries: integerFrom(env, 'CONSERVA_SHARD_RETRIES', 5, 0),
    maintenanceSeconds: integerFrom(env, 'CONSERVA_QUEUE_MAINTENANCE_SECONDS', 30, 1),
    progressMs,
    smtpUrl: smtpUrlFrom(env, production),
    mailFrom: mailFromOf(env),
    publicUrl: publicUrlFrom(env),
  };
}
