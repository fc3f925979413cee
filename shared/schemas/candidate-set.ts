import * as z from 'zod';
import { coordinateNameSchema, userRefSchema } from './recording.js';
import { generatorSettingsSchema, referenceTermSchema } from './sweep-description.js';

/*
 * Candidate sets: the terms a sweep chooses subsets from, the known terms in every model, and the reference
 * term. Terms are stored as written; the server parses every one (shared/math/term-expression.ts) and refuses
 * a set with a bad term: 400 `invalid_body` with `fields` keyed `terms.<index>`, `known.<index>` or
 * `reference.term`, so a form can show each message next to its term.
 *
 * Routes (project-scoped; viewers read, analysts of the team and admins write):
 *   GET    /api/projects/:projectId/candidate-sets            -> candidateSetListSchema
 *   POST   /api/projects/:projectId/candidate-sets            candidateSetInputSchema -> 201 candidateSetSchema
 *   POST   /api/projects/:projectId/candidate-sets/check      candidateSetCheckInputSchema -> termCheckSchema (saves nothing)
 *   POST   /api/projects/:projectId/candidate-sets/generate   termGenerateInputSchema -> generatedTermsSchema (saves nothing)
 *   GET    /api/candidate-sets/:id                            -> candidateSetSchema
 *   PUT    /api/candidate-sets/:id                            candidateSetInputSchema -> candidateSetSchema
 *   DELETE /api/candidate-sets/:id                            -> 204 (sweeps keep their frozen copy)
 */

const termText = z.string('Write the term as text.').trim().min(1, 'A term cannot be empty.').max(500, 'A term is limited to 500 characters.');

/** Body of POST (create) and PUT (replace) of a candidate set. */
export const candidateSetInputSchema = z
  .object({
    name: z.string('Give the candidate set a name.').trim().min(1, 'Give the candidate set a name.').max(120, 'The name can have at most 120 characters.'),
    coordinates: z.array(coordinateNameSchema).min(1, 'Name at least one coordinate.').max(8, 'At most 8 coordinates.'),
    terms: z.array(termText).min(1, 'List at least one candidate term.').max(400, 'At most 400 candidate terms.'),
    known: z.array(termText).max(20, 'At most 20 known terms.').default([]),
    reference: referenceTermSchema.nullable().default(null),
    /** The generator options the terms were made with, kept so the editor can show and re-run them. */
    generator: generatorSettingsSchema.nullable().default(null),
  })
  .strict();
export type CandidateSetInput = z.infer<typeof candidateSetInputSchema>;
export type CandidateSetInputRaw = z.input<typeof candidateSetInputSchema>;

/** Body of the check route: a candidate set as being edited (the name may still be missing). */
export const candidateSetCheckInputSchema = candidateSetInputSchema.extend({
  name: z.string().trim().max(120, 'The name can have at most 120 characters.').optional(),
});
export type CandidateSetCheckInput = z.infer<typeof candidateSetCheckInputSchema>;

/** The verdict on one term as typed. */
export const termVerdictSchema = z.object({
  index: z.number().int(),
  typed: z.string(),
  /** Canonical spelling, null when the term was refused. */
  text: z.string().nullable(),
  /** Homogeneous degree in the velocities (2 kinetic, 0 potential), null when mixed or refused. */
  velocityDegree: z.number().int().nullable(),
  /** Why the term is refused (the set cannot be saved), or null. */
  error: z.string().nullable(),
  /** Why the sweep will leave it out (a repeat or multiple of another term), or null. */
  excluded: z.string().nullable(),
});
export type TermVerdict = z.infer<typeof termVerdictSchema>;

/** One problem of a candidate set; `path` is `terms.3`, `known.0`, `reference.term`, `coordinates` or `set`. */
export const termProblemSchema = z.object({ path: z.string(), message: z.string() });
export type TermProblem = z.infer<typeof termProblemSchema>;

/** Answer of the check route. */
export const termCheckSchema = z.object({
  valid: z.boolean(),
  terms: z.array(termVerdictSchema),
  known: z.array(termVerdictSchema),
  reference: termVerdictSchema.nullable(),
  problems: z.array(termProblemSchema),
  /** Candidates a sweep chooses from after repeats are left out (0 when the set is not valid). */
  candidateCount: z.number().int(),
  warnings: z.array(z.string()),
});
export type TermCheck = z.infer<typeof termCheckSchema>;

/** Body of the generate route. */
export const termGenerateInputSchema = z
  .object({
    coordinates: z.array(coordinateNameSchema).min(1, 'Name at least one coordinate.').max(8, 'At most 8 coordinates.'),
    generator: generatorSettingsSchema,
  })
  .strict();
export type TermGenerateInput = z.infer<typeof termGenerateInputSchema>;

export const termFamilies = ['coordinate-power', 'trigonometric', 'angle-difference', 'kinetic', 'added'] as const;

/** Answer of the generate route: the terms in the generator's order, additions last, removals left out. */
export const generatedTermsSchema = z.object({
  terms: z.array(z.object({ text: z.string(), family: z.enum(termFamilies) })),
});
export type GeneratedTerms = z.infer<typeof generatedTermsSchema>;

/** A stored candidate set. */
export const candidateSetSchema = z.object({
  id: z.string(),
  projectId: z.string(),
  name: z.string(),
  coordinates: z.array(z.string()),
  terms: z.array(z.string()),
  known: z.array(z.string()),
  reference: referenceTermSchema.nullable(),
  generator: generatorSettingsSchema.nullable(),
  /** Candidates a sweep chooses from after repeats are left out. */
  candidateCount: z.number().int(),
  createdBy: userRefSchema.nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type CandidateSetView = z.infer<typeof candidateSetSchema>;

export const candidateSetListSchema = z.object({ candidateSets: z.array(candidateSetSchema) });
export type CandidateSetList = z.infer<typeof candidateSetListSchema>;
