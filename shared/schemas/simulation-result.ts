import * as z from 'zod';
import {
  massMatrixCheckSchema,
  modelCheckSettingsSchema,
  modelValidationSchema,
  trajectoryComparisonSchema,
} from './model-validation.js';

/*
 * What `conserva simulate <model.json> <recording.csv> --json` prints: the model driven through one recording
 * from its initial state by its recorded forces, compared with it.
 */
export const simulationResultSchema = z.object({
  model: z.object({
    title: z.string().nullable(),
    coordinates: z.array(z.string()),
    energy: z.string(),
    lagrangian: z.string(),
  }),
  recording: z.string(),
  /** Which CSV column was read for what: `time`, each coordinate, `d<name>` velocities and `u_<name>` forces found. */
  columns: z.record(z.string(), z.string()),
  settings: modelCheckSettingsSchema,
  /** Error figures, energy drift (passive recordings) and how the simulation ended. */
  figures: modelValidationSchema,
  massMatrix: massMatrixCheckSchema,
  /** Simulated and recorded positions and their difference, every sample or thinned with --points. */
  trajectory: trajectoryComparisonSchema,
  warnings: z.array(z.string()),
  caution: z.string(),
});
export type SimulationResult = z.infer<typeof simulationResultSchema>;
