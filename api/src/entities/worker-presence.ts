import { defineEntity, type InferEntity } from '@mikro-orm/core';

const p = defineEntity.properties;

/**
 * A worker process's heartbeat: who it is, how many threads it runs and how it cuts shards (for estimates and
 * the admin view).
 */
export const WorkerPresence = defineEntity({
  name: 'WorkerPresence',
  properties: {
    id: p.string().length(200).primary(),
    host: p.string().length(200),
    pid: p.integer(),
    threads: p.integer(),
    /** CPU seconds a shard is cut to take (CONSERVA_SHARD_SECONDS). */
    shardSeconds: p.double().$type<number>().default(30),
    /** A fixed number of subsets per shard instead (CONSERVA_SHARD_SUBSETS), or null. */
    shardSubsets: p.double().$type<number>().nullable(),
    startedAt: p.datetime(),
    lastSeenAt: p.datetime().index(),
  },
});
export type WorkerPresence = InferEntity<typeof WorkerPresence>;
