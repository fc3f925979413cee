import * as z from 'zod';
import { sweepLeaderboardSchema } from './sweep-leaderboard.js';
import { shardSummarySchema, sweepDetailSchema, sweepStateSchema, sweepSummarySchema } from './sweep.js';

/*
 * The live view: a WebSocket at /ws on the app's own origin, authenticated by the session cookie. A client
 * subscribes to sweeps it may see (its team's; admins: all). On subscribe it first receives `state` (the
 * current sweep and leaderboard from the database), then updates as they happen. Progress arrives at least
 * once a second while the sweep runs and at most ten times a second.
 */

export const liveClientMessageSchema = z.discriminatedUnion('type', [
  z.object({ type: z.literal('subscribe'), sweepId: z.string() }).strict(),
  z.object({ type: z.literal('unsubscribe'), sweepId: z.string() }).strict(),
]);
export type LiveClientMessage = z.infer<typeof liveClientMessageSchema>;

export const liveProgressSchema = z.object({
  type: z.literal('progress'),
  sweepId: z.string(),
  state: sweepStateSchema,
  /** Subsets scored and rejected so far, merged shards plus the running shards' counts. */
  evaluated: z.number(),
  rejected: z.number(),
  totalSubsets: z.number(),
  runningShards: z.number().int(),
  /** Subsets covered per second over the last few seconds; null until measurable. */
  subsetsPerSecond: z.number().nullable(),
  /** Remaining subsets at that rate; null until measurable. */
  etaSeconds: z.number().nullable(),
  /** Seconds since the sweep started running. */
  elapsedSeconds: z.number(),
  /** Shards merged complete, and shards planned (0 until the prepare step has planned them). */
  shardsDone: z.number().int(),
  shardCount: z.number().int(),
  /** CPU seconds so far: the merged shards' charges plus the running shards' time. */
  cpuSeconds: z.number(),
  at: z.string(),
});
export type LiveProgress = z.infer<typeof liveProgressSchema>;

export const liveServerMessageSchema = z.discriminatedUnion('type', [
  /** First message after subscribe: the sweep and its leaderboard as stored now. */
  z.object({ type: z.literal('state'), sweep: sweepDetailSchema, leaderboard: sweepLeaderboardSchema }),
  liveProgressSchema,
  /** Shards whose state or counts changed; right after the prepare step has planned them, every shard. */
  z.object({ type: z.literal('shards'), sweepId: z.string(), shards: z.array(shardSummarySchema) }),
  /** The leaderboard after a shard merged into it (or after the finish step). */
  z.object({ type: z.literal('leaderboard'), sweepId: z.string(), leaderboard: sweepLeaderboardSchema }),
  /** The sweep changed state but has not ended (queued -> running). */
  z.object({ type: z.literal('sweep'), sweepId: z.string(), sweep: sweepSummarySchema }),
  /** The sweep reached an end state (finished, cancelled, failed, halted). */
  z.object({ type: z.literal('ended'), sweepId: z.string(), sweep: sweepSummarySchema }),
  /** A refused subscription (`not_found` for sweeps of other teams) or message. */
  z.object({ type: z.literal('error'), sweepId: z.string().nullable(), code: z.string(), message: z.string() }),
]);
export type LiveServerMessage = z.infer<typeof liveServerMessageSchema>;
