import * as z from 'zod';

/*
 * A team's compute allowance and its use in the current calendar month (UTC).
 *   GET   /api/allowance[?teamId=]            -> allowanceStatusSchema (own team; admins may name one)
 *   GET   /api/admin/allowances               -> allowanceListSchema (every team)
 *   PATCH /api/admin/allowances/:teamId       allowanceUpdateSchema -> allowanceStatusSchema
 * A launch beyond a limit is refused with 409 `allowance_exceeded`, the message stating limit and estimate.
 */

export const allowanceLimitsSchema = z
  .object({
    /** CPU seconds (busy seconds of one worker thread) the team may use per calendar month. */
    cpuSecondsPerMonth: z
      .number('Give the monthly CPU time as a number.')
      .int('Give the monthly CPU time in whole seconds.')
      .min(0, 'The monthly CPU time cannot be negative.')
      .max(1e12, 'The monthly CPU time is limited to a million million seconds.'),
    /** Sweeps queued or running at the same time. */
    sweepsAtOnce: z
      .number('Give the sweeps at once as a number.')
      .int('Sweeps at once are a whole number.')
      .min(0, 'Sweeps at once cannot be negative.')
      .max(1000, 'At most 1,000 sweeps at once.'),
    /** Subsets one sweep may evaluate. */
    subsetsPerSweep: z
      .number('Give the subsets per sweep as a number.')
      .int('Subsets per sweep are a whole number.')
      .min(0, 'Subsets per sweep cannot be negative.')
      .max(Number.MAX_SAFE_INTEGER, 'Subsets per sweep are limited to 9,007,199,254,740,991.'),
  })
  .strict();
export type AllowanceLimits = z.infer<typeof allowanceLimitsSchema>;

/** Body of PATCH /api/admin/allowances/:teamId: any of the limits. */
export const allowanceUpdateSchema = allowanceLimitsSchema
  .partial()
  .refine((update) => Object.keys(update).length > 0, 'Change at least one limit.');
export type AllowanceUpdate = z.infer<typeof allowanceUpdateSchema>;

/** A team's limits with its use this month. */
export const allowanceStatusSchema = z.object({
  ...allowanceLimitsSchema.shape,
  teamId: z.string(),
  teamName: z.string(),
  /** The calendar month (UTC) the use is counted in, `YYYY-MM`. */
  month: z.string(),
  /** CPU seconds charged this month (measured, per shard). */
  cpuSecondsUsed: z.number(),
  /** CPU seconds still expected by the team's queued and running sweeps (estimate minus what they were charged). */
  cpuSecondsReserved: z.number(),
  /** cpuSecondsPerMonth - used - reserved, never below 0. */
  cpuSecondsRemaining: z.number(),
  /** Sweeps queued or running now. */
  sweepsActive: z.number().int(),
});
export type AllowanceStatus = z.infer<typeof allowanceStatusSchema>;

export const allowanceListSchema = z.object({ month: z.string(), allowances: z.array(allowanceStatusSchema) });
export type AllowanceList = z.infer<typeof allowanceListSchema>;

/** The limit a launch would break. */
export const allowanceLimitNames = ['subsetsPerSweep', 'sweepsAtOnce', 'cpuSecondsPerMonth'] as const;
export const allowanceRefusalSchema = z.object({ limit: z.enum(allowanceLimitNames), message: z.string() });
export type AllowanceRefusal = z.infer<typeof allowanceRefusalSchema>;
