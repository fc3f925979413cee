import * as z from 'zod';
import { allowanceRefusalSchema, allowanceStatusSchema } from './allowance.js';
import { excludedTermSchema } from './discovery-result.js';
import { userRefSchema } from './recording.js';
import { recordingRoleSchema, referenceTermSchema, sweepSettingsSchema } from './sweep-description.js';

/*
 * Sweeps: a launched search over subsets with its description frozen at launch, run as shards on workers.
 *   POST /api/projects/:projectId/sweeps/estimate  sweepLaunchSchema -> sweepEstimateSchema (saves nothing)
 *   POST /api/projects/:projectId/sweeps           sweepLaunchSchema -> 201 sweepDetailSchema
 *                                                  (409 `allowance_exceeded` naming limit and estimate)
 *   GET  /api/projects/:projectId/sweeps[?state=]  -> sweepListSchema, newest first
 *   GET  /api/sweeps/:id                           -> sweepDetailSchema
 *   POST /api/sweeps/:id/cancel                    -> sweepDetailSchema (409 `conflict` once it has ended)
 *   GET  /api/sweeps/:id/leaderboard               -> sweepLeaderboardSchema (sweep-leaderboard.ts)
 */

export const sweepStates = ['queued', 'running', 'finished', 'cancelled', 'failed', 'halted'] as const;
export const sweepStateSchema = z.enum(sweepStates);
export type SweepState = z.infer<typeof sweepStateSchema>;
/** States a sweep never leaves. `halted`: the team's monthly CPU allowance ran out while it ran. */
export const endedSweepStates: readonly SweepState[] = ['finished', 'cancelled', 'failed', 'halted'];

export const shardStates = ['queued', 'running', 'done', 'cancelled', 'failed'] as const;
export const shardStateSchema = z.enum(shardStates);
export type ShardState = z.infer<typeof shardStateSchema>;

const shape = sweepSettingsSchema.shape;

/** The file-free settings of a launch: sizes, regression form, leaderboard length, derivatives, balance windows. */
export const sweepRunSettingsSchema = z
  .object({
    sizes: shape.sizes,
    form: shape.form,
    top: shape.top,
    derivatives: shape.derivatives,
    balance: shape.balance,
  })
  .strict();
export type SweepRunSettings = z.infer<typeof sweepRunSettingsSchema>;
export type SweepRunSettingsInput = z.input<typeof sweepRunSettingsSchema>;

/** Body of the launch and of the estimate. Recordings must belong to the same project and map every coordinate. */
export const sweepLaunchSchema = z
  .object({
    name: z.string('Write the name as text.').trim().max(120, 'The name can have at most 120 characters.').optional(),
    candidateSetId: z.uuid('Choose a candidate set.'),
    trainingRecordingIds: z
      .array(z.uuid('Choose the recording from the list.'), 'Choose the training recordings.')
      .min(1, 'Choose at least one training recording.')
      .max(50, 'At most 50 training recordings.'),
    validationRecordingIds: z
      .array(z.uuid('Choose the recording from the list.'), 'Choose the validation recordings.')
      .max(50, 'At most 50 validation recordings.')
      .default([]),
    settings: sweepRunSettingsSchema,
  })
  .strict()
  .superRefine((launch, ctx) => {
    const seen = new Set<string>();
    for (const [list, ids] of [
      ['trainingRecordingIds', launch.trainingRecordingIds],
      ['validationRecordingIds', launch.validationRecordingIds],
    ] as const) {
      ids.forEach((id, i) => {
        if (seen.has(id)) ctx.addIssue({ code: 'custom', message: 'A recording can be chosen once only.', path: [list, i] });
        seen.add(id);
      });
    }
  });
export type SweepLaunch = z.infer<typeof sweepLaunchSchema>;
export type SweepLaunchInput = z.input<typeof sweepLaunchSchema>;

/** What an estimate's figures rest on, so people can tell a measurement from a default. */
export const estimateBasisSchema = z.object({
  source: z.enum(['measured', 'partly measured', 'default']),
  /** Finished shards (speed) or finished sweeps (fixed costs) the measurement rests on; 0 for defaults. */
  samples: z.number().int(),
  /** In words, e.g. "measured on this installation over the last 14 shards" or "default until measured". */
  text: z.string(),
});
export type EstimateBasis = z.infer<typeof estimateBasisSchema>;

/** Expected work of one subset size. */
export const sizeEstimateSchema = z.object({
  size: z.number().int(),
  subsets: z.number(),
  subsetsPerCpuSecond: z.number(),
  /** True when the rate was measured on finished shards, false for the built-in default. */
  measured: z.boolean(),
  cpuSeconds: z.number(),
});
export type SizeEstimate = z.infer<typeof sizeEstimateSchema>;

/** Answer of the estimate route (and part of the refusal of a launch). */
export const sweepEstimateSchema = z.object({
  /**
   * Candidates after repeats are left out. The prepare step may leave out more (columns that are zero on the
   * data), so this is an upper bound and the estimate errs on the high side.
   */
  candidateCount: z.number().int(),
  knownCount: z.number().int(),
  sizes: z.object({ min: z.number().int(), max: z.number().int() }),
  perSize: z.array(sizeEstimateSchema),
  totalSubsets: z.number(),
  /** CPU seconds the team is charged: its shards' time on worker threads, at the speed per size. */
  cpuSeconds: z.number(),
  /** Shards the prepare step will cut, as the running workers cut them. */
  shardCount: z.number().int(),
  /** Wall seconds beyond the subsets: preparing, handling each shard, finishing. */
  fixedCosts: z.object({ prepareSeconds: z.number(), shardOverheadSeconds: z.number(), finishSeconds: z.number() }),
  /** Threads of the workers that reported within the last 30 s. */
  workerThreads: z.number().int(),
  /**
   * Launch to finish on those threads: prepare, the shards (CPU seconds and handling) spread over the threads,
   * finish; null when no worker is running.
   */
  wallSeconds: z.number().nullable(),
  /** What the speed (CPU seconds) and the fixed costs rest on. */
  basis: z.object({ speed: estimateBasisSchema, fixedCosts: estimateBasisSchema }),
  allowance: allowanceStatusSchema,
  fits: z.boolean(),
  /** One entry per limit the launch would break, each message stating the limit and the estimate. */
  refusals: z.array(allowanceRefusalSchema),
  warnings: z.array(z.string()),
});
export type SweepEstimate = z.infer<typeof sweepEstimateSchema>;

/** A contiguous range of subset ranks of one size. */
export const rankSliceSchema = z.object({
  size: z.number().int(),
  firstRank: z.number().int(),
  endRank: z.number().int(),
});

export const shardSummarySchema = z.object({
  id: z.string(),
  index: z.number().int(),
  /** The rank ranges the shard covers (consecutive, in size then rank order). */
  slices: z.array(rankSliceSchema),
  subsets: z.number(),
  state: shardStateSchema,
  attempts: z.number().int(),
  /** The worker that ran it last (host:pid). */
  worker: z.string().nullable(),
  evaluated: z.number(),
  rejected: z.number(),
  cpuSeconds: z.number(),
  startedAt: z.string().nullable(),
  endedAt: z.string().nullable(),
});
export type ShardSummary = z.infer<typeof shardSummarySchema>;

/** The best model found so far (from the leaderboard), or the chosen best model once finished. */
export const sweepBestSchema = z.object({
  terms: z.array(z.string()),
  energy: z.string(),
  rss: z.number(),
});

export const sweepSummarySchema = z.object({
  id: z.string(),
  projectId: z.string(),
  teamId: z.string(),
  name: z.string(),
  state: sweepStateSchema,
  /** Why it failed or halted, in words; null otherwise. */
  stateReason: z.string().nullable(),
  candidateSet: z.object({ id: z.string().nullable(), name: z.string() }),
  launchedBy: userRefSchema,
  launchedAt: z.string(),
  startedAt: z.string().nullable(),
  endedAt: z.string().nullable(),
  cancelledBy: userRefSchema.nullable(),
  cancelledAt: z.string().nullable(),
  totalSubsets: z.number(),
  evaluated: z.number(),
  rejected: z.number(),
  cpuSeconds: z.number(),
  estimatedCpuSeconds: z.number(),
  shardCount: z.number().int(),
  shardsDone: z.number().int(),
  best: sweepBestSchema.nullable(),
});
export type SweepSummary = z.infer<typeof sweepSummarySchema>;

/** The description as frozen at launch. */
export const frozenSweepDescriptionSchema = z.object({
  coordinates: z.array(z.string()),
  terms: z.array(z.string()),
  known: z.array(z.string()),
  reference: referenceTermSchema.nullable(),
  settings: sweepRunSettingsSchema,
  recordings: z.array(z.object({ id: z.string(), name: z.string(), role: recordingRoleSchema })),
});
export type FrozenSweepDescription = z.infer<typeof frozenSweepDescriptionSchema>;

export const sweepDetailSchema = sweepSummarySchema.extend({
  description: frozenSweepDescriptionSchema,
  /** Candidates actually swept (after screening on the data); null before the prepare step. */
  candidateCount: z.number().int().nullable(),
  excluded: z.array(excludedTermSchema),
  warnings: z.array(z.string()),
  shards: z.array(shardSummarySchema),
});
export type SweepDetail = z.infer<typeof sweepDetailSchema>;

export const sweepListSchema = z.object({ sweeps: z.array(sweepSummarySchema) });
export type SweepList = z.infer<typeof sweepListSchema>;

export const sweepListQuerySchema = z.object({ state: sweepStateSchema.optional() });
