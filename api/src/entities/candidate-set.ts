import { randomUUID } from 'node:crypto';
import { defineEntity, type InferEntity } from '@mikro-orm/core';
import type { GeneratorSettings, ReferenceTerm } from '../../../shared/schemas/sweep-description.js';
import { Project } from './project.js';

const p = defineEntity.properties;

/** Terms as written, known terms and the reference of one project; sweeps copy them at launch. */
export const CandidateSet = defineEntity({
  name: 'CandidateSet',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    project: p.manyToOne(Project).deleteRule('cascade'),
    name: p.string().length(120),
    coordinates: p.json<string[]>(),
    terms: p.json<string[]>(),
    known: p.json<string[]>(),
    reference: p.json<ReferenceTerm>().nullable(),
    generator: p.json<GeneratorSettings>().nullable(),
    candidateCount: p.integer(),
    createdById: p.uuid().nullable(),
    createdByName: p.string().length(120).nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p.datetime().onCreate(() => new Date()).onUpdate(() => new Date()),
  },
  uniques: [{ properties: ['project', 'name'] }],
});
export type CandidateSet = InferEntity<typeof CandidateSet>;
