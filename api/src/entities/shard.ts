import { randomUUID } from 'node:crypto';
import { defineEntity, type InferEntity } from '@mikro-orm/core';
import type { SweepSlice } from '../../../shared/math/sweep-problem.js';
import { shardStates } from '../../../shared/schemas/sweep.js';
import { Sweep } from './sweep.js';

const p = defineEntity.properties;

/** A contiguous stretch of a sweep's rank space: the unit of work one worker thread takes. */
export const Shard = defineEntity({
  name: 'Shard',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    sweep: p.manyToOne(Sweep).deleteRule('cascade'),
    index: p.integer(),
    slices: p.json<SweepSlice[]>(),
    subsets: p.double().$type<number>(),
    state: p.enum([...shardStates]),
    attempts: p.integer().default(0),
    worker: p.string().length(200).nullable(),
    evaluated: p.double().$type<number>().default(0),
    rejected: p.double().$type<number>().default(0),
    cpuSeconds: p.double().$type<number>().default(0),
    startedAt: p.datetime().nullable(),
    endedAt: p.datetime().nullable(),
  },
  uniques: [{ properties: ['sweep', 'index'] }],
});
export type Shard = InferEntity<typeof Shard>;
