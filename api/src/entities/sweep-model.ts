import { randomUUID } from 'node:crypto';
import { defineEntity, type InferEntity } from '@mikro-orm/core';
import type { ModelDetails } from '../../../shared/schemas/model-details.js';
import { Sweep } from './sweep.js';

const p = defineEntity.properties;

/**
 * One model of a finished sweep worked out (shared/model/model-details.ts): its place in the sweep's result
 * (0 is the best) and everything the model view shows, computed on the first request and kept. The pair
 * (sweep, model index) is unique, so concurrent first requests cannot store two versions of one model.
 */
export const SweepModel = defineEntity({
  name: 'SweepModel',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    sweep: p.manyToOne(Sweep).deleteRule('cascade'),
    modelIndex: p.integer(),
    // json, not jsonb: the text is kept as written, so keys keep their order (jsonb sorts them), and the
    // model document downloaded from it reads format and version first, as our format is documented.
    details: p.json<ModelDetails>().columnType('json'),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
  uniques: [{ properties: ['sweep', 'modelIndex'] }],
});
export type SweepModel = InferEntity<typeof SweepModel>;
