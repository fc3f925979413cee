import * as z from 'zod';

/*
 * What a sweep is asked to do. Two layers, so the API can reuse the part that has nothing to do with files:
 * - sweepSettingsSchema: coordinates, candidate terms, known and reference terms, sizes, regression form,
 *   signal and window settings;
 * - sweepDescriptionSchema: the settings plus the recordings (file names relative to the description, each
 *   train or validate) and how their CSV columns map onto time, coordinates, velocities and forces.
 * Expressions are only checked for being non-empty text here; the math layer parses them and names the term
 * at fault.
 */

const expressionText = z.string('Write the term as text.').trim().min(1, 'A term cannot be empty.').max(500, 'A term is limited to 500 characters.');

/** A whole number in [min, max], with one plain sentence for every way it can be wrong. */
export function wholeNumber(min: number, max: number, sentence: string) {
  return z.number(sentence).int(sentence).min(min, sentence).max(max, sentence);
}

/** Options of the candidate generator (shared/math/term-generator.ts documents the families and counts). */
export const generatorSettingsSchema = z
  .object({
    polynomialDegree: wholeNumber(0, 4, 'The polynomial degree is a whole number from 0 to 4.').optional(),
    angles: z.array(z.string(), 'List the coordinates that are angles.').optional(),
    trigonometric: z.boolean('Sines and cosines are switched on (true) or off (false).').optional(),
    differences: z.boolean('Angle differences are switched on (true) or off (false).').optional(),
    velocityDegree: wholeNumber(2, 4, 'The velocity degree is a whole number from 2 to 4.').optional(),
    kineticFactors: z.boolean('Factors of the kinetic terms are switched on (true) or off (false).').optional(),
    kineticPolynomialDegree: wholeNumber(0, 3, 'The polynomial degree of kinetic factors is a whole number from 0 to 3.').optional(),
    /** Terms added to the generated ones. */
    add: z.array(expressionText, 'List the terms to add.').default([]),
    /** Generated terms to leave out (compared by their canonical spelling). */
    remove: z.array(expressionText, 'List the terms to leave out.').default([]),
  })
  .strict();
export type GeneratorSettings = z.infer<typeof generatorSettingsSchema>;

/** Defaults of the derivative estimator: a Savitzky-Golay differentiator, edges trimmed. */
export const defaultDerivativeSettings = { method: 'savitzky-golay', window: 9, order: 4 } as const;

/** How velocities and accelerations are estimated from positions, per recording. */
export const derivativeSettingsSchema = z.discriminatedUnion(
  'method',
  [
    z.object({ method: z.literal('central') }).strict(),
    z
      .object({
        method: z.literal('savitzky-golay'),
        window: wholeNumber(3, 201, 'The Savitzky-Golay window is a whole number of samples from 3 to 201.').refine(
          (w) => w % 2 === 1,
          'The Savitzky-Golay window must be an odd number of samples.',
        ),
        order: wholeNumber(2, 10, 'The Savitzky-Golay order is a whole number from 2 to 10.'),
      })
      .strict()
      .refine((s) => s.order <= s.window - 2, { message: 'The Savitzky-Golay window must be at least two samples longer than its order (for example window 9 with order 4).', path: ['order'] }),
  ],
  { error: 'Choose the derivative method "savitzky-golay" (with a window and an order) or "central".' },
);
export type DerivativeSettings = z.infer<typeof derivativeSettingsSchema>;

export const defaultBalanceSettings = { window: 20, stride: 5, integration: 'simpson' } as const;

/** Windows of the balance form, counted in sample intervals; the power is integrated within each window. */
export const balanceSettingsSchema = z
  .object({
    window: wholeNumber(2, 100_000, 'A balance window spans a whole number of sample intervals from 2 to 100,000.').default(defaultBalanceSettings.window),
    stride: wholeNumber(1, 100_000, 'The balance stride is a whole number of samples from 1 to 100,000.').default(defaultBalanceSettings.stride),
    integration: z.enum(['trapezoid', 'simpson'], 'The power is integrated by "simpson" or "trapezoid".').default(defaultBalanceSettings.integration),
  })
  .strict();
export type BalanceSettings = z.infer<typeof balanceSettingsSchema>;

export const referenceTermSchema = z
  .object({
    term: expressionText,
    coefficient: z
      .number('Give the reference coefficient as a number.')
      .refine((c) => Number.isFinite(c) && c !== 0, 'The reference coefficient must be a finite number other than 0.'),
  })
  .strict();
export type ReferenceTerm = z.infer<typeof referenceTermSchema>;

const sizeRangeSchema = z
  .object({
    min: z
      .number('Give the smallest size as a whole number of extra terms.')
      .int('The smallest size is a whole number of extra terms.')
      .min(0, 'The smallest size cannot be below 0.')
      .max(12, 'At most 12 extra terms per model.')
      .default(0),
    max: z
      .number('Give the largest size as a whole number of extra terms.')
      .int('The largest size is a whole number of extra terms.')
      .min(0, 'The largest size cannot be below 0.')
      .max(12, 'At most 12 extra terms per model.'),
  })
  .strict()
  .refine((s) => s.min <= s.max, { message: 'The smallest size cannot exceed the largest.', path: ['min'] });

const sweepSettingsShape = {
  /** Names of the generalized coordinates; velocities are `d<name>`, accelerations `dd<name>`. */
  coordinates: z
    .array(z.string().trim().min(1, 'A coordinate name cannot be empty.'))
    .min(1, 'Name at least one coordinate.')
    .max(8, 'At most 8 coordinates.'),
  /** The candidate set as expressions; give this or `generate`. */
  terms: z.array(expressionText).min(1, 'List at least one candidate term.').max(400, 'At most 400 candidate terms.').optional(),
  /** Generator options; give this or `terms`. */
  generate: generatorSettingsSchema.optional(),
  /** Terms in every model. */
  known: z.array(expressionText).max(20, 'At most 20 known terms.').default([]),
  /** Extra terms beyond the known ones in the models the sweep tries. */
  sizes: sizeRangeSchema,
  form: z.enum(['derivative', 'balance'], 'The form is "balance" or "derivative".').default('balance'),
  /** Term with a fixed coefficient; required when the recordings carry no forces. */
  reference: referenceTermSchema.optional(),
  /** Leaderboard length. */
  top: wholeNumber(1, 100, 'The leaderboard keeps a whole number of models from 1 to 100.').default(10),
  derivatives: derivativeSettingsSchema.default(defaultDerivativeSettings),
  balance: balanceSettingsSchema.default(defaultBalanceSettings),
};

function candidateSourceRule(settings: { terms?: unknown; generate?: unknown }, ctx: z.RefinementCtx): void {
  if ((settings.terms === undefined) === (settings.generate === undefined)) {
    ctx.addIssue({ code: 'custom', message: 'Give the candidate terms either as "terms" or as "generate" options, not both or neither.', path: ['terms'] });
  }
}

/** The part of a sweep description that does not depend on files (reused by the API). */
export const sweepSettingsSchema = z.object(sweepSettingsShape).strict().superRefine(candidateSourceRule);
export type SweepSettings = z.infer<typeof sweepSettingsSchema>;
/** Settings as written, before defaults are filled in. */
export type SweepSettingsInput = z.input<typeof sweepSettingsSchema>;

/**
 * Which CSV column holds what: `time`, one column per coordinate keyed by its name, optional velocity columns
 * keyed `d<name>`, optional `forces` mapping a coordinate to its generalized-force column.
 */
export const columnMappingSchema = z
  .object({
    time: z.string('Name the time column.').min(1, 'Name the time column.'),
    forces: z.record(z.string(), z.string('Name the force column.').min(1, 'Name the force column.')).optional(),
  })
  .catchall(z.string('Name a column.').min(1, 'Name a column.'));
/** The mapping as code builds it (zod's inferred type cannot express `forces` beside the string columns). */
export interface ColumnMapping {
  time: string;
  forces?: Record<string, string>;
  [key: string]: string | Record<string, string> | undefined;
}

export const recordingRoleSchema = z.enum(['train', 'validate'], 'The role is "train" or "validate".');
export type RecordingRole = z.infer<typeof recordingRoleSchema>;

export const recordingReferenceSchema = z
  .object({
    file: z.string().min(1, 'Give the file name of the recording.'),
    role: recordingRoleSchema,
  })
  .strict();

/** A complete description as the command line reads it. */
export const sweepDescriptionSchema = z
  .object({
    ...sweepSettingsShape,
    recordings: z.array(recordingReferenceSchema).min(1, 'List at least one recording.'),
    columns: columnMappingSchema,
  })
  .strict()
  .superRefine(candidateSourceRule)
  .superRefine((description, ctx) => {
    if (!description.recordings.some((r) => r.role === 'train')) {
      ctx.addIssue({ code: 'custom', message: 'At least one recording must have the role "train".', path: ['recordings'] });
    }
    checkColumnMapping(description.coordinates, description.columns, ctx);
  });
export type SweepDescription = z.infer<typeof sweepDescriptionSchema>;

function checkColumnMapping(coordinates: string[], columns: ColumnMapping, ctx: z.RefinementCtx): void {
  for (const coordinate of coordinates) {
    if (typeof columns[coordinate] !== 'string') {
      ctx.addIssue({ code: 'custom', message: `Name the column of coordinate "${coordinate}".`, path: ['columns', coordinate] });
    }
  }
  const allowed = new Set(['time', 'forces', ...coordinates, ...coordinates.map((c) => `d${c}`)]);
  for (const key of Object.keys(columns)) {
    if (!allowed.has(key)) {
      ctx.addIssue({
        code: 'custom',
        message: `"${key}" is neither time, a coordinate, a velocity (d<coordinate>) nor forces.`,
        path: ['columns', key],
      });
    }
  }
  for (const key of Object.keys(columns.forces ?? {})) {
    if (!coordinates.includes(key)) {
      ctx.addIssue({ code: 'custom', message: `Forces are given for "${key}", which is not a coordinate.`, path: ['columns', 'forces', key] });
    }
  }
}

/** One line per problem, each starting with the path of the field at fault. */
export function describeSchemaIssues(error: z.ZodError): string {
  return error.issues
    .map((issue) => {
      const path = issue.path.map((p) => (typeof p === 'number' ? `[${p}]` : `.${String(p)}`)).join('').replace(/^\./, '');
      return `${path || '(description)'}: ${issue.message}`;
    })
    .join('\n');
}
