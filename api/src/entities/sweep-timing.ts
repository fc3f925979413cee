import { defineEntity, type InferEntity } from '@mikro-orm/core';

const p = defineEntity.properties;

/**
 * What a finished sweep took beyond its subsets, measured when it finished: the fixed costs the estimate of
 * later sweeps rests on (shared/sweeps/fixed-costs.ts). Times are wall seconds. The sweep is a plain id: the
 * measurement outlives a deleted sweep.
 */
export const SweepTiming = defineEntity({
  name: 'SweepTiming',
  properties: {
    sweepId: p.uuid().primary(),
    finishedAt: p.datetime().index(),
    /** From the launch until the shards were planned: the prepare job's wait in the queue and its work. */
    prepareSeconds: p.double().$type<number>(),
    /** From the last shard's merge until the sweep finished: the finish job's wait and its work. */
    finishSeconds: p.double().$type<number>(),
    shardCount: p.integer(),
    /** Threads of the workers that ran its shards. */
    threads: p.integer(),
    /** CPU seconds charged for its shards. */
    shardCpuSeconds: p.double().$type<number>(),
    /** From the plan until the last shard merged. */
    shardPhaseSeconds: p.double().$type<number>(),
    /** Wall seconds per shard, per thread, beyond its CPU seconds: taking the job, reading the problem, merging. */
    shardOverheadSeconds: p.double().$type<number>(),
  },
});
export type SweepTiming = InferEntity<typeof SweepTiming>;
