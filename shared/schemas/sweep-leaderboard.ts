import * as z from 'zod';
import { discoveryResultSchema } from './discovery-result.js';
import { sweepStateSchema } from './sweep.js';

/** One subset on the leaderboard while the sweep runs: fitted on the scaled problem, turned back to the terms' units. */
export const leaderboardEntrySchema = z.object({
  /** Candidate terms beyond the known ones. */
  size: z.number().int(),
  /** Known terms, chosen candidates, and the reference term last when there is one. */
  terms: z.array(z.string()),
  coefficients: z.array(z.number()),
  energy: z.string(),
  /** Residual sum of squares of the regression. */
  rss: z.number(),
  /** sqrt(rss / rows). */
  rmse: z.number(),
});
export type LeaderboardEntry = z.infer<typeof leaderboardEntrySchema>;

/**
 * Answer of GET /api/sweeps/:id/leaderboard and the payload of the live `leaderboard` message. `version`
 * grows with every merged shard. Once the sweep has finished, `result` holds the worked-out models exactly as
 * the command line reports them (discovery-result.ts); it stays null for sweeps that ended otherwise.
 */
export const sweepLeaderboardSchema = z.object({
  sweepId: z.string(),
  state: sweepStateSchema,
  version: z.number().int(),
  evaluated: z.number(),
  rejected: z.number(),
  totalSubsets: z.number(),
  /** Regression rows of the training data; null before the prepare step. */
  rowCount: z.number().int().nullable(),
  overall: z.array(leaderboardEntrySchema),
  bySize: z.array(z.object({ size: z.number().int(), entries: z.array(leaderboardEntrySchema) })),
  result: discoveryResultSchema.nullable(),
  caution: z.string(),
});
export type SweepLeaderboard = z.infer<typeof sweepLeaderboardSchema>;
