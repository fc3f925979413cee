import * as z from 'zod';
import { derivativeSettingsSchema, balanceSettingsSchema, referenceTermSchema } from './sweep-description.js';

/*
 * What a finished discovery reports (the command line prints it as JSON; the API will store and serve it).
 * Expressions are in the notation users type, numbers inside them as String(x), which round-trips doubles.
 */

export const discoveredModelSchema = z.object({
  /** Number of candidate terms beyond the known ones. */
  size: z.number().int(),
  /** Known terms, chosen candidates, and the reference term last when there is one. */
  terms: z.array(z.string()),
  /** Energy coefficient of each term (the reference term's is the fixed value). */
  coefficients: z.array(z.number()),
  energy: z.string(),
  lagrangian: z.string(),
  /** Lagrangian coefficient of each term; null where the energy cannot determine it. */
  lagrangianCoefficients: z.array(z.number().nullable()),
  /** Terms of velocity degree one: invisible in the energy, so their Lagrangian coefficient is unknown. */
  notIdentifiable: z.array(z.string()),
  /** rms(Lambda d - E) / rms(E) of the Legendre step; near zero when E is the Hamiltonian of such an L. */
  legendreResidual: z.number(),
  rss: z.number(),
  trainRmse: z.number(),
  validationRmse: z.number().nullable(),
  r2: z.number().nullable(),
  bic: z.number(),
  /** Condition number of the fitted columns scaled to unit norm. */
  conditionNumber: z.number(),
});
export type DiscoveredModel = z.infer<typeof discoveredModelSchema>;

/** The best model of one size, for the front of error against size. */
export const sizeFrontEntrySchema = z.object({
  size: z.number().int(),
  terms: z.array(z.string()),
  trainRmse: z.number(),
  validationRmse: z.number().nullable(),
  bic: z.number(),
  /** Root mean square residual expected from the noise in the signals alone, when it could be estimated. */
  noiseFloorRmse: z.number().nullable(),
});
export type SizeFrontEntry = z.infer<typeof sizeFrontEntrySchema>;

/** A term left out of the first-ranked model because it changes the energy negligibly (shared/math/negligible-terms.ts). */
export const droppedTermSchema = z.object({
  term: z.string(),
  /** Its coefficient in the model it was dropped from. */
  coefficient: z.number(),
  /** rms change of the energy on the training samples, relative to the energy's variation, once it is left out. */
  energyChange: z.number(),
});

export const simplificationSchema = z.object({
  /** Terms of the first-ranked model before its negligible terms were left out. */
  from: z.array(z.string()),
  dropped: z.array(droppedTermSchema),
  /** Energy changes below this are negligible. */
  tolerance: z.number(),
});

export const excludedTermSchema = z.object({ term: z.string(), reason: z.string() });

/** How noisy one coordinate's signals are (shared/math/signal-noise.ts). */
export const coordinateNoiseSchema = z.object({
  coordinate: z.string(),
  /** Standard deviation of the white noise on its positions, estimated from the recordings, in its own unit. */
  positionNoise: z.number(),
  /** rms of the noise in its estimated (or measured) velocity over the rms of that velocity, noise included. */
  velocityShare: z.number(),
  /** The same for its estimated acceleration; null when the form needs no accelerations. */
  accelerationShare: z.number().nullable(),
});
export type CoordinateNoise = z.infer<typeof coordinateNoiseSchema>;

/** How far noise of the size the recordings carry moves the first-ranked model's coefficients (shared/math/coefficient-noise.ts). */
export const coefficientNoiseSchema = z.object({
  /** The fitted terms of the first model (the reference term's coefficient is fixed, so it is not among them). */
  terms: z.array(z.string()),
  /** Per term, the rms relative change of its coefficient when as much noise again is added: about its error from noise. */
  shifts: z.array(z.number()),
});
export type CoefficientNoiseReport = z.infer<typeof coefficientNoiseSchema>;

export const signalReportSchema = z.object({
  /** The estimator and its parameters as requested. */
  estimator: derivativeSettingsSchema,
  /** The same in words. */
  description: z.string(),
  velocities: z.enum(['estimated', 'measured', 'measured and estimated']),
  accelerations: z.enum(['estimated', 'not needed']),
  /** Per coordinate, over the training recordings; absent in results stored before it was measured. */
  noise: z.array(coordinateNoiseSchema).optional(),
});

export const discoveryResultSchema = z.object({
  evaluated: z.number().int(),
  rejected: z.number().int(),
  seconds: z.number(),
  form: z.enum(['derivative', 'balance']),
  balance: balanceSettingsSchema.nullable(),
  signals: signalReportSchema,
  trainingRows: z.number().int(),
  validationRows: z.number().int().nullable(),
  candidateCount: z.number().int(),
  known: z.array(z.string()),
  reference: referenceTermSchema.nullable(),
  /** How models of different sizes were ranked. */
  rankedBy: z.enum(['validation', 'bic']),
  /**
   * Scores within this distance of the best are indistinguishable from it; among those the smallest model
   * ranks first (5 % of the best validation error or its noise floor, whichever is larger; 2 for BIC).
   */
  rankingTolerance: z.number(),
  models: z.array(discoveredModelSchema),
  /**
   * When the first-ranked model carried terms that change its energy negligibly: which, and from what model.
   * The first model is then the model without them. Null when nothing was dropped; absent in results stored
   * before the rule existed.
   */
  simplification: simplificationSchema.nullable().optional(),
  /** The first model's coefficients under more noise; null without a model; absent in results stored before it was measured. */
  coefficientNoise: coefficientNoiseSchema.nullable().optional(),
  front: z.array(sizeFrontEntrySchema),
  best: z
    .object({
      terms: z.array(z.string()),
      coefficients: z.array(z.number()),
      energy: z.string(),
      lagrangian: z.string(),
      notIdentifiable: z.array(z.string()),
    })
    .nullable(),
  excluded: z.array(excludedTermSchema),
  warnings: z.array(z.string()),
  caution: z.string(),
});
export type DiscoveryResult = z.infer<typeof discoveryResultSchema>;
