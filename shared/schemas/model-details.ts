import * as z from 'zod';
import { modelDocumentSchema } from './model-document.js';
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

export const modelDetailsSchema = z.object({
  document: modelDocumentSchema,
  latex: modelLatexSchema,
  settings: modelCheckSettingsSchema,
  /** One per recording given (training and validation). */
  massMatrixChecks: z.array(massMatrixCheckSchema),
  /** One per validation recording; the training recordings when there is none (a warning says so). */
  validations: z.array(recordingCheckSchema),
  warnings: z.array(z.string()),
  caution: z.string(),
});
export type ModelDetails = z.infer<typeof modelDetailsSchema>;
