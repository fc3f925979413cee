import * as z from 'zod';
import { derivativeSettingsSchema } from './sweep-description.js';

/*
 * What a model's checks on recordings report: where its mass matrix is not positive definite, and how well its
 * simulation follows a recording. Times are in the recording's time unit, errors in each coordinate's unit.
 */

/** Consecutive samples where the mass matrix is not positive definite. */
export const stateIntervalSchema = z.object({ from: z.number(), to: z.number(), samples: z.number().int() });

export const massMatrixCheckSchema = z.object({
  recording: z.string(),
  /** States checked (the samples where positions and velocities are known). */
  checkedStates: z.number().int(),
  notPositiveDefinite: z.number().int(),
  /** Runs of consecutive failing samples, the first 20. */
  intervals: z.array(stateIntervalSchema),
  /** The first 50 failing states: index of the sample in the recording, and its time. */
  states: z.array(z.object({ index: z.number().int(), time: z.number() })),
  /**
   * Smallest Cholesky pivot (before its square root) over the largest diagonal entry, over every state: near 0
   * the matrix is nearly singular, at or below 0 it is not positive definite; null when no state gave a number.
   */
  smallestPivotRatio: z.number().nullable(),
});
export type MassMatrixCheck = z.infer<typeof massMatrixCheckSchema>;

export const simulationStatusSchema = z.enum(['finished', 'singular-mass-matrix', 'diverged', 'too-many-steps']);

export const coordinateErrorSchema = z.object({
  coordinate: z.string(),
  /** Root mean square of simulated minus recorded position over the simulated samples. */
  rms: z.number(),
  /** Largest absolute difference. */
  max: z.number(),
});

export const energyDriftSchema = z.object({
  /** max |E(t) - E(t_start)| of the model's energy along the simulated motion. */
  absolute: z.number(),
  /** absolute / scale. */
  relative: z.number(),
  /** max over the simulated samples of sum_j |c_j theta_j|: the size of the energy's parts. */
  scale: z.number(),
});

/** How a model's simulation follows one recording. */
export const modelValidationSchema = z.object({
  recording: z.string(),
  role: z.enum(['train', 'validate']),
  /** No generalized force on any coordinate: the energy drift is reported. */
  passive: z.boolean(),
  status: simulationStatusSchema,
  /** Why the simulation ended early; null when it reached the end of the recording. */
  message: z.string().nullable(),
  /** Time of the initial state (the first sample with a known velocity) and the last time simulated. */
  start: z.number(),
  end: z.number(),
  /** Last time of the recording. */
  recordedEnd: z.number(),
  /** Samples compared. */
  samples: z.number().int(),
  errors: z.array(coordinateErrorSchema),
  /** Largest absolute error of any coordinate. */
  maxError: z.number(),
  /** The error threshold asked for, in coordinate units, applied to every coordinate. */
  threshold: z.number(),
  /** Seconds from the start until some coordinate's error first exceeds the threshold; null if it never does. */
  timeToThreshold: z.number().nullable(),
  energyDrift: energyDriftSchema.nullable(),
});
export type ModelValidation = z.infer<typeof modelValidationSchema>;

/** Simulated against recorded positions and their difference, per coordinate, on (possibly thinned) samples. */
export const trajectoryComparisonSchema = z.object({
  time: z.array(z.number()),
  /** Keyed by coordinate name. */
  simulated: z.record(z.string(), z.array(z.number())),
  recorded: z.record(z.string(), z.array(z.number())),
  error: z.record(z.string(), z.array(z.number())),
});
export type TrajectoryComparison = z.infer<typeof trajectoryComparisonSchema>;

/** How recorded forces are read between samples during a simulation (model-simulation.ts). */
export const forceInterpolationSchema = z.enum(['cubic', 'linear', 'hold']);
export type ForceInterpolation = z.infer<typeof forceInterpolationSchema>;

/** The settings a model was checked with. */
export const modelCheckSettingsSchema = z.object({
  /** Error threshold in coordinate units, applied to every coordinate. */
  threshold: z.number().positive(),
  /** Estimator of the initial velocities (and of the states for the mass-matrix check). */
  estimator: derivativeSettingsSchema,
  forceInterpolation: forceInterpolationSchema,
  /** Relative tolerance of the integrator (the absolute one is 1e-3 of it). */
  rtol: z.number().positive(),
});
export type ModelCheckSettings = z.infer<typeof modelCheckSettingsSchema>;
