import { defineEntity, type InferEntity } from '@mikro-orm/core';

const p = defineEntity.properties;

/** Measured speed of the sweep per subset size: subsets and CPU seconds of finished shards, decayed over time. */
export const SubsetThroughput = defineEntity({
  name: 'SubsetThroughput',
  properties: {
    size: p.integer().primary().autoincrement(false),
    subsets: p.double().$type<number>(),
    cpuSeconds: p.double().$type<number>(),
    updatedAt: p.datetime().onCreate(() => new Date()).onUpdate(() => new Date()),
  },
});
export type SubsetThroughput = InferEntity<typeof SubsetThroughput>;
