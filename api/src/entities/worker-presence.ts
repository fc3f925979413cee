import { defineEntity, type InferEntity } from '@mikro-orm/core';

const p = defineEntity.properties;

/** A worker process's heartbeat: who it is and how many threads it runs (for estimates and the admin view). */
export const WorkerPresence = defineEntity({
  name: 'WorkerPresence',
  properties: {
    id: p.string().length(200).primary(),
    host: p.string().length(200),
    pid: p.integer(),
    threads: p.integer(),
    startedAt: p.datetime(),
    lastSeenAt: p.datetime().index(),
  },
});
export type WorkerPresence = InferEntity<typeof WorkerPresence>;
