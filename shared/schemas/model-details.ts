import * as z from 'zod';
import { modelDocumentSchema } from './model-document.js';
import { balanceSettingsSchema, recordingRoleSchema } from './sweep-description.js';
import {
  massMatrixCheckSchema,
  modelCheckSettingsSchema,
  modelValidationSchema,
  trajectoryComparisonSchema,
} from './model-validation.js';

/*
 * Everything the model view shows about one model, computed once (shared/model/model-details.ts) and stored:
 * the model document, its formulas as LaTeX, the mass-matrix check on every recording, and its simulation
 * against the validation recordings with figures and thinned series for the plots.
 */

export const modelLatexSchema = z.object({
  energy: z.string(),
  lagrangian: z.string(),
  /** One equation per coordinate: sum_k M_ik ddq_k = f_i. */
  equations: z.array(z.string()),
  massMatrix: z.string(),
  forceVector: z.string(),
});

export const recordingCheckSchema = z.object({
  figures: modelValidationSchema,
  trajectory: trajectoryComparisonSchema,
});
export type RecordingCheck = z.infer<typeof recordingCheckSchema>;

/**
 * The residual of the energy balance dE/dt = P of the model on one recording, in the rows of the sweep's
 * regression form: per sample the energy's rate less the input power (derivative form), or per window the
 * energy's change less the integrated power, at the window's end time (balance form). Units: energy per time
 * unit, or energy.
 */
export const fitResidualSchema = z.object({
  recording: z.string(),
  role: recordingRoleSchema,
  /** Regression rows on this recording (samples, or windows). */
  rows: z.number().int(),
  /** Root mean square and largest absolute value of the residual over every row. */
  rms: z.number(),
  max: z.number(),
  /** Root mean square of the input-power side (P, or its integral over each window); 0 on passive recordings. */
  powerRms: z.number(),
  /** Root mean square over the rows of sum_j |c_j a_ij|: the size of the energy's exchanges the balance weighs. */
  partsRms: z.number(),
  /** Row times and residuals, thinned for plots (every k-th row, the last one kept). */
  time: z.array(z.number()),
  residual: z.array(z.number()),
});
export type FitResidual = z.infer<typeof fitResidualSchema>;

export const fitResidualsSchema = z.object({
  form: z.enum(['derivative', 'balance']),
  /** The balance windows (balance form), in sample intervals; null for the derivative form. */
  balance: balanceSettingsSchema.nullable(),
  /** One per recording given (training and validation). */
  recordings: z.array(fitResidualSchema),
});
export type FitResiduals = z.infer<typeof fitResidualsSchema>;

export const modelDetailsSchema = z.object({
  document: modelDocumentSchema,
  latex: modelLatexSchema,
  settings: modelCheckSettingsSchema,
  /** One per recording given (training and validation). */
  massMatrixChecks: z.array(massMatrixCheckSchema),
  /** One per validation recording; the training recordings when there is none (a warning says so). */
  validations: z.array(recordingCheckSchema),
  /**
   * The fit's energy-balance residual per recording. Optional: models worked out before it existed were stored
   * without it (the API works those out again when they are next opened).
   */
  fitResiduals: fitResidualsSchema.optional(),
  warnings: z.array(z.string()),
  caution: z.string(),
});
export type ModelDetails = z.infer<typeof modelDetailsSchema>;
