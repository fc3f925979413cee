import * as z from 'zod';

/*
 * What names one worked-out model of a finished sweep and its downloads:
 *   GET /api/sweeps/:sweepId/models/:modelIndex                  -> ModelDetails (model-details.ts)
 *   GET /api/sweeps/:sweepId/models/:modelIndex/exports/:format  -> the file
 * The model index is the 0-based place in the sweep's result `models` (best first).
 */

/** The download formats, in the order they are offered. */
export const modelExportFormats = ['latex', 'c', 'typescript', 'python', 'json', 'report'] as const;
export const modelExportFormatSchema = z.enum(modelExportFormats, {
  error: () => `must be one of ${modelExportFormats.join(', ')}`,
});
export type ModelExportFormat = z.infer<typeof modelExportFormatSchema>;

/** A place in the result's models as written in a path: a whole number without sign or leading zeros. */
export const modelIndexSchema = z
  .string()
  .regex(/^(0|[1-9]\d{0,5})$/, 'must be a whole number from 0')
  .transform(Number);
