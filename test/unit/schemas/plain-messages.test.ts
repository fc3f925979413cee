import { expect } from 'chai';
import type * as z from 'zod';
import { allowanceLimitsSchema, allowanceUpdateSchema } from '../../../shared/schemas/allowance.js';
import { candidateSetInputSchema, termGenerateInputSchema } from '../../../shared/schemas/candidate-set.js';
import { safeParsePlain } from '../../../shared/schemas/plain-issue-message.js';
import { projectInputSchema } from '../../../shared/schemas/project.js';
import { recordingMappingSchema, recordingUploadFieldsSchema } from '../../../shared/schemas/recording.js';
import { signInSchema } from '../../../shared/schemas/session.js';
import { sweepLaunchSchema } from '../../../shared/schemas/sweep.js';
import { sweepDescriptionSchema } from '../../../shared/schemas/sweep-description.js';
import { teamInputSchema } from '../../../shared/schemas/team-admin.js';
import { userCreateSchema } from '../../../shared/schemas/user-admin.js';

/** zod's own wording, which must never reach a person: "Too big: expected number to be <=12" and its kin. */
const zodWording = /^(Invalid|Too big|Too small|Unrecognized|Expected|Required$)|expected .*(received|to be|to have)|[<>]=/;

const description = {
  coordinates: ['th'],
  recordings: [{ file: 'run.csv', role: 'train' }],
  columns: { time: 't', th: 'angle' },
  terms: ['cos(th)', 'dth^2'],
  sizes: { max: 2 },
};
const uuid = '0b5c1a52-6a8e-4c1b-9d7e-2f3a4b5c6d7e';
const launch = { candidateSetId: uuid, trainingRecordingIds: [uuid], settings: { sizes: { max: 2 } } };
const mapping = { time: { column: 't' }, coordinates: [{ name: 'x', column: 'pos' }] };
const candidateSet = { name: 'Set', coordinates: ['x'], terms: ['dx^2'] };

/** Each case breaks one or more constraints of a schema people meet in a form, a description file or a request. */
const cases: { what: string; schema: z.ZodType; input: unknown }[] = [
  { what: 'description: sizes beyond 12 and below 0', schema: sweepDescriptionSchema, input: { ...description, sizes: { min: -1, max: 13 } } },
  { what: 'description: fractional and reversed sizes', schema: sweepDescriptionSchema, input: { ...description, sizes: { min: 2.5, max: 1 } } },
  { what: 'description: sizes missing', schema: sweepDescriptionSchema, input: { ...description, sizes: undefined } },
  { what: 'description: an unknown field', schema: sweepDescriptionSchema, input: { ...description, extra: 1 } },
  { what: 'description: a form not on the list', schema: sweepDescriptionSchema, input: { ...description, form: 'integral' } },
  { what: 'description: a leaderboard of 0 models', schema: sweepDescriptionSchema, input: { ...description, top: 0 } },
  { what: 'description: top as text', schema: sweepDescriptionSchema, input: { ...description, top: '5' } },
  { what: 'description: nine coordinates', schema: sweepDescriptionSchema, input: { ...description, coordinates: ['a', 'b', 'c', 'd', 'e', 'f', 'g', 'h', 'i'] } },
  { what: 'description: an unknown derivative method', schema: sweepDescriptionSchema, input: { ...description, derivatives: { method: 'spline' } } },
  { what: 'description: a Savitzky-Golay window and order out of range', schema: sweepDescriptionSchema, input: { ...description, derivatives: { method: 'savitzky-golay', window: 2, order: 1 } } },
  { what: 'description: a Savitzky-Golay window too large and order too high', schema: sweepDescriptionSchema, input: { ...description, derivatives: { method: 'savitzky-golay', window: 203, order: 11 } } },
  { what: 'description: balance windows out of range', schema: sweepDescriptionSchema, input: { ...description, balance: { window: 1, stride: 0, integration: 'euler' } } },
  { what: 'description: 21 known terms and 401 candidates', schema: sweepDescriptionSchema, input: { ...description, known: Array(21).fill('x'), terms: Array(401).fill('x') } },
  { what: 'description: generator options out of range', schema: sweepDescriptionSchema, input: { ...description, terms: undefined, generate: { polynomialDegree: 9, velocityDegree: 1, kineticPolynomialDegree: 4, trigonometric: 'yes' } } },
  { what: 'description: a reference term without coefficient', schema: sweepDescriptionSchema, input: { ...description, reference: { term: 'dth^2' } } },
  { what: 'description: a recording role not on the list', schema: sweepDescriptionSchema, input: { ...description, recordings: [{ file: 'run.csv', role: 'test' }] } },
  { what: 'description: columns without time', schema: sweepDescriptionSchema, input: { ...description, columns: { th: 'angle' } } },
  { what: 'launch: sizes beyond 12', schema: sweepLaunchSchema, input: { ...launch, settings: { sizes: { max: 13 } } } },
  { what: 'launch: a recording id that is not one', schema: sweepLaunchSchema, input: { ...launch, trainingRecordingIds: ['run-1'] } },
  { what: 'launch: 51 validation recordings and a long name', schema: sweepLaunchSchema, input: { ...launch, name: 'n'.repeat(121), validationRecordingIds: Array(51).fill(uuid) } },
  { what: 'candidate set: long name, nine coordinates, too many terms', schema: candidateSetInputSchema, input: { ...candidateSet, name: 'n'.repeat(121), coordinates: Array(9).fill('x'), terms: Array(401).fill('x'), known: Array(21).fill('x') } },
  { what: 'candidate set: a coordinate name of 41 characters', schema: candidateSetInputSchema, input: { ...candidateSet, coordinates: [`x${'y'.repeat(40)}`] } },
  { what: 'candidate set: a generator with a bad option', schema: termGenerateInputSchema, input: { coordinates: [], generator: { velocityDegree: 7 } } },
  { what: 'recording mapping: nine coordinates and a long unit', schema: recordingMappingSchema, input: { ...mapping, coordinates: Array(9).fill({ name: 'x', column: 'pos', unit: 'u'.repeat(41) }) } },
  { what: 'recording mapping: time missing, a column name too long', schema: recordingMappingSchema, input: { coordinates: [{ name: 'x', column: 'c'.repeat(201) }] } },
  { what: 'recording upload: an empty name', schema: recordingUploadFieldsSchema, input: { name: '', mapping } },
  { what: 'allowance: negative, fractional and too large limits', schema: allowanceLimitsSchema, input: { cpuSecondsPerMonth: -1, sweepsAtOnce: 1.5, subsetsPerSweep: 2 ** 60 } },
  { what: 'allowance: limits as text, too many sweeps', schema: allowanceUpdateSchema, input: { cpuSecondsPerMonth: 'lots', sweepsAtOnce: 1001 } },
  { what: 'project: a long name and description', schema: projectInputSchema, input: { name: 'n'.repeat(121), description: 'd'.repeat(2001) } },
  { what: 'team: a long name', schema: teamInputSchema, input: { name: 'n'.repeat(121) } },
  { what: 'user: a long name, an unknown role', schema: userCreateSchema, input: { email: 'a@b.example', name: 'n'.repeat(121), password: 'p'.repeat(12), role: 'owner', teamId: uuid } },
  { what: 'sign-in: a long password', schema: signInSchema, input: { email: 'a@b.example', password: 'p'.repeat(201) } },
];

describe('validation messages people read are plain sentences of our own', () => {
  for (const { what, schema, input } of cases) {
    it(`${what}`, () => {
      const result = safeParsePlain(schema, input);
      expect(result.success).to.equal(false);
      for (const issue of result.error!.issues) {
        const where = issue.path.join('.') || '(whole)';
        expect(issue.message, `${where}: ${issue.message}`).not.to.match(zodWording);
        expect(issue.message, `${where}: ${issue.message}`).to.match(/^["A-Z].*\.$/);
      }
    });
  }

  it('words the common cases as a person would read them', () => {
    const messages = (schema: z.ZodType, input: unknown) =>
      Object.fromEntries(safeParsePlain(schema, input).error!.issues.map((i) => [i.path.join('.'), i.message]));
    expect(messages(sweepDescriptionSchema, { ...description, sizes: { max: 13 } })).to.deep.equal({ 'sizes.max': 'At most 12 extra terms per model.' });
    expect(messages(sweepDescriptionSchema, { ...description, sizes: undefined })).to.deep.equal({ sizes: 'This field is required.' });
    expect(messages(sweepDescriptionSchema, { ...description, extra: 1 })).to.deep.equal({ '': '"extra" is not a field here: check its spelling, or leave it out.' });
    expect(messages(sweepDescriptionSchema, { ...description, form: 'integral' })).to.deep.equal({ form: 'The form is "balance" or "derivative".' });
    expect(messages(sweepDescriptionSchema, { ...description, top: '5' })).to.deep.equal({ top: 'The leaderboard keeps a whole number of models from 1 to 100.' });
    expect(messages(allowanceLimitsSchema, { cpuSecondsPerMonth: 10, sweepsAtOnce: 1, subsetsPerSweep: 10, spare: 1, other: 2 })).to.deep.equal({
      '': '"spare" and "other" are not fields here: check their spelling, or leave them out.',
    });
  });
});
