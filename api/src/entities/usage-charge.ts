import { randomUUID } from 'node:crypto';
import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { Team } from './team.js';

const p = defineEntity.properties;

/**
 * The usage ledger: CPU seconds charged for one shard. The shard id is unique, so a shard that runs twice
 * (a retry after a crash) is charged, counted and merged once. Sweep and shard are plain ids: the ledger
 * outlives deleted sweeps.
 */
export const UsageCharge = defineEntity({
  name: 'UsageCharge',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    team: p.manyToOne(Team).deleteRule('cascade'),
    sweepId: p.uuid().index(),
    shardId: p.uuid().unique(),
    cpuSeconds: p.double().$type<number>(),
    subsets: p.double().$type<number>(),
    chargedAt: p.datetime().onCreate(() => new Date()),
  },
  indexes: [{ properties: ['team', 'chargedAt'] }],
});
export type UsageCharge = InferEntity<typeof UsageCharge>;
