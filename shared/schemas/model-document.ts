import * as z from 'zod';
import { derivativeSettingsSchema, recordingRoleSchema } from './sweep-description.js';

/*
 * Conserva's own file format for a finished model ("conserva-model", version 1): everything another program
 * needs to use the model without Conserva. The Lagrangian's terms and coefficients are the source of truth; the
 * equations of motion are derived from them and stored as text for readers. Expressions use the notation users
 * type (`0.5*dth^2 - 1.2*cos(th)`): coordinates by name, velocities `d<name>`, the generalized force on a
 * coordinate `u_<name>`, numbers written with every digit (String(x) of a double).
 */

export const MODEL_FORMAT = 'conserva-model';
export const MODEL_FORMAT_VERSION = 1;

const expression = z.string().min(1).max(100_000);
const finite = z.number().refine(Number.isFinite, 'must be a finite number');

export const energyTermSchema = z.object({ term: expression, coefficient: finite }).strict();
/** A Lagrangian coefficient is null for a term the energy cannot determine (velocity degree one). */
export const lagrangianTermSchema = z.object({ term: expression, coefficient: finite.nullable() }).strict();

export const modelProvenanceSchema = z
  .object({
    /** What produced the model, e.g. "conserva discover". */
    source: z.string(),
    form: z.enum(['derivative', 'balance']).nullable(),
    /** The derivative estimator of the sweep; simulation estimates initial velocities with it too. */
    estimator: derivativeSettingsSchema.nullable(),
    recordings: z.array(z.object({ name: z.string(), role: recordingRoleSchema }).strict()),
    /** The sweep's settings as they were run (kept as written, for the record). */
    sweep: z.record(z.string(), z.unknown()).nullable(),
    /** Scores of the model on its sweep, when it came from one. */
    scores: z
      .object({
        trainRmse: z.number(),
        validationRmse: z.number().nullable(),
        bic: z.number(),
        conditionNumber: z.number(),
        legendreResidual: z.number(),
      })
      .strict()
      .nullable(),
  })
  .strict();
export type ModelProvenance = z.infer<typeof modelProvenanceSchema>;

export const modelDocumentSchema = z
  .object({
    format: z.literal(MODEL_FORMAT),
    version: z.literal(MODEL_FORMAT_VERSION),
    title: z.string().max(200).nullable(),
    /** ISO 8601 time of writing, or null. */
    createdAt: z.string().nullable(),
    coordinates: z.array(z.string().min(1)).min(1).max(8),
    symbols: z
      .object({
        /** `d<name>` per coordinate. */
        velocities: z.array(z.string()),
        /** `u_<name>` per coordinate: the generalized force on it. */
        forces: z.array(z.string()),
      })
      .strict(),
    energy: z.object({ expression, terms: z.array(energyTermSchema) }).strict(),
    lagrangian: z.object({ expression, terms: z.array(lagrangianTermSchema).min(1) }).strict(),
    /** M(q, dq) ddq = f(q, dq, u), derived from the Lagrangian. */
    equations: z
      .object({
        massMatrix: z.array(z.array(z.string())),
        forceVector: z.array(z.string()),
        /** Lagrangian terms left out of the equations (null coefficient). */
        leftOut: z.array(z.string()),
      })
      .strict(),
    provenance: modelProvenanceSchema,
    caution: z.string(),
  })
  .strict()
  .superRefine((doc, ctx) => {
    const n = doc.coordinates.length;
    const issue = (path: (string | number)[], message: string) => ctx.addIssue({ code: 'custom', path, message });
    if (doc.symbols.velocities.length !== n) issue(['symbols', 'velocities'], `needs one entry per coordinate (${n})`);
    if (doc.symbols.forces.length !== n) issue(['symbols', 'forces'], `needs one entry per coordinate (${n})`);
    if (doc.equations.forceVector.length !== n) issue(['equations', 'forceVector'], `needs one entry per coordinate (${n})`);
    if (doc.equations.massMatrix.length !== n || doc.equations.massMatrix.some((row) => row.length !== n)) {
      issue(['equations', 'massMatrix'], `must be ${n} rows of ${n} entries`);
    }
  });
export type ModelDocument = z.infer<typeof modelDocumentSchema>;
