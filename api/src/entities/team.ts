import { randomUUID } from 'node:crypto';
import { defineEntity, type InferEntity } from '@mikro-orm/core';

const p = defineEntity.properties;

/** The unit of ownership: users belong to one team, and a team's work is visible to its members only. */
export const Team = defineEntity({
  name: 'Team',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    name: p.string().length(120).unique(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
export type Team = InferEntity<typeof Team>;
