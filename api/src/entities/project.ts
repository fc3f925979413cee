import { randomUUID } from 'node:crypto';
import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { Team } from './team.js';

const p = defineEntity.properties;

/** One mechanism under study; belongs to one team. Project names are unique within their team. */
export const Project = defineEntity({
  name: 'Project',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    team: p.manyToOne(Team),
    name: p.string().length(120),
    description: p.text(),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p.datetime().onCreate(() => new Date()).onUpdate(() => new Date()),
  },
  uniques: [{ properties: ['team', 'name'] }],
});
export type Project = InferEntity<typeof Project>;
