import { defineEntity, type InferEntity } from '@mikro-orm/core';

const p = defineEntity.properties;

/**
 * Measured speed of the sweep per subset size: subsets and CPU seconds of finished shards, and how many shards
 * measured the size, all decayed over time alike.
 */
export const SubsetThroughput = defineEntity({
  name: 'SubsetThroughput',
  properties: {
    size: p.integer().primary().autoincrement(false),
    subsets: p.double().$type<number>(),
    cpuSeconds: p.double().$type<number>(),
    shards: p.double().$type<number>().default(0),
    updatedAt: p.datetime().onCreate(() => new Date()).onUpdate(() => new Date()),
  },
});
export type SubsetThroughput = InferEntity<typeof SubsetThroughput>;
