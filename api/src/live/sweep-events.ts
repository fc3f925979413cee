import type { EntityManager } from '@mikro-orm/postgresql';
import * as z from 'zod';

/**
 * What workers and the API tell the live hub through PostgreSQL NOTIFY on one channel. Payloads are small
 * (ids and counters; the hub reads the rest from the database) and always carry the team, so the hub can
 * check a subscriber's team before forwarding. A NOTIFY sent inside a transaction is delivered only when it
 * commits: the hub never hears of a merge before it can read it.
 */
export const sweepEventChannel = 'conserva_sweep_events';

export const sweepEventSchema = z.discriminatedUnion('kind', [
  /** A running shard's counters so far (not yet merged into the sweep). */
  z.object({
    kind: z.literal('progress'),
    sweepId: z.string(),
    teamId: z.string(),
    shardId: z.string(),
    evaluated: z.number(),
    rejected: z.number(),
    elapsed: z.number(),
  }),
  /** The prepare step planned the sweep's shards (sent before the sweep's change to running). */
  z.object({ kind: z.literal('planned'), sweepId: z.string(), teamId: z.string() }),
  /** A shard changed state (started, done, cancelled, failed). */
  z.object({ kind: z.literal('shard'), sweepId: z.string(), teamId: z.string(), shardId: z.string() }),
  /** A shard merged into the leaderboard, or the finish step stored the result. */
  z.object({ kind: z.literal('leaderboard'), sweepId: z.string(), teamId: z.string(), version: z.number() }),
  /** The sweep changed state. */
  z.object({ kind: z.literal('state'), sweepId: z.string(), teamId: z.string(), state: z.string() }),
]);
export type SweepEvent = z.infer<typeof sweepEventSchema>;

/** Sends the event through the entity manager (inside its transaction when it has one). */
export async function notifySweepEvent(em: EntityManager, event: SweepEvent): Promise<void> {
  await em.execute('select pg_notify(?, ?)', [sweepEventChannel, JSON.stringify(event)]);
}
