import type PgBoss from 'pg-boss';
import * as z from 'zod';

/**
 * The job queues of a sweep's life (design: launch -> prepare -> shards -> finish -> ended). Payloads carry
 * ids only; everything else is read from the database, so a job that runs twice finds the work done and
 * leaves it. Jobs that fail past their retries land in the dead-letter queue, which fails the sweep.
 */
export const sweepQueueNames = {
  prepare: 'sweep-prepare',
  shard: 'sweep-shard',
  finish: 'sweep-finish',
  ended: 'sweep-ended',
  deadLetter: 'sweep-dead-letter',
} as const;

export const prepareJobSchema = z.object({ kind: z.literal('prepare'), sweepId: z.uuid() }).strict();
export const shardJobSchema = z.object({ kind: z.literal('shard'), sweepId: z.uuid(), shardId: z.uuid() }).strict();
export const finishJobSchema = z.object({ kind: z.literal('finish'), sweepId: z.uuid() }).strict();
export const endedJobSchema = z.object({ kind: z.literal('ended'), sweepId: z.uuid() }).strict();
/** Whatever job failed for good: its payload, passed on by pg-boss. */
export const deadLetterJobSchema = z.discriminatedUnion('kind', [prepareJobSchema, shardJobSchema, finishJobSchema, endedJobSchema]);

export type PrepareJob = z.infer<typeof prepareJobSchema>;
export type ShardJob = z.infer<typeof shardJobSchema>;
export type FinishJob = z.infer<typeof finishJobSchema>;
export type EndedJob = z.infer<typeof endedJobSchema>;
export type SweepJob = z.infer<typeof deadLetterJobSchema>;

/** Retry and expiry of the jobs that are not shards (shards take theirs from the worker's settings). */
export const sweepJobDefaults = {
  prepare: { retryLimit: 2, retryDelay: 2, expireInSeconds: 600 },
  finish: { retryLimit: 2, retryDelay: 2, expireInSeconds: 600 },
  ended: { retryLimit: 3, retryDelay: 5, expireInSeconds: 120 },
} as const;

/**
 * Creates the queues (idempotent: pg-boss keeps a queue's first options). The finish queue is "stately":
 * one finish per sweep can be queued and one active at a time, keyed by the sweep id.
 */
export async function createSweepQueues(boss: PgBoss): Promise<void> {
  await boss.createQueue(sweepQueueNames.deadLetter, { name: sweepQueueNames.deadLetter, retryLimit: 3, retryDelay: 5 });
  const withDeadLetter = { deadLetter: sweepQueueNames.deadLetter };
  await boss.createQueue(sweepQueueNames.prepare, { name: sweepQueueNames.prepare, ...sweepJobDefaults.prepare, ...withDeadLetter });
  await boss.createQueue(sweepQueueNames.shard, { name: sweepQueueNames.shard, retryLimit: 3, ...withDeadLetter });
  await boss.createQueue(sweepQueueNames.finish, { name: sweepQueueNames.finish, policy: 'stately', ...sweepJobDefaults.finish, ...withDeadLetter });
  await boss.createQueue(sweepQueueNames.ended, { name: sweepQueueNames.ended, ...sweepJobDefaults.ended });
}
