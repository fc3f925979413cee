import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { Team } from './team.js';

const p = defineEntity.properties;

/**
 * A team's compute limits (admins set them). The row is created with the defaults the first time a team
 * estimates or launches; launches lock it (SELECT ... FOR UPDATE) so two cannot both take the last of it.
 */
export const TeamAllowance = defineEntity({
  name: 'TeamAllowance',
  properties: {
    team: p.oneToOne(Team).primary().deleteRule('cascade'),
    cpuSecondsPerMonth: p.double().$type<number>(),
    sweepsAtOnce: p.integer(),
    subsetsPerSweep: p.double().$type<number>(),
    updatedAt: p.datetime().onCreate(() => new Date()).onUpdate(() => new Date()),
  },
});
export type TeamAllowance = InferEntity<typeof TeamAllowance>;
