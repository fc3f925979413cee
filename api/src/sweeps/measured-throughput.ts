import type { EntityManager } from '@mikro-orm/postgresql';
import type { MeasuredThroughput } from '../../../shared/sweeps/sweep-estimate.js';
import { SubsetThroughput } from '../entities/subset-throughput.js';
import { WorkerPresence } from '../entities/worker-presence.js';

/** A worker that reported within this many milliseconds counts as running. */
export const workerAliveMs = 30_000;

/** Measured subsets and CPU seconds per size. */
export async function measuredThroughput(em: EntityManager): Promise<MeasuredThroughput> {
  const rows = await em.find(SubsetThroughput, {});
  return new Map(rows.map((row) => [row.size, { subsets: row.subsets, cpuSeconds: row.cpuSeconds }]));
}

/** Threads of the workers seen lately. */
export async function liveWorkerThreads(em: EntityManager, now = new Date()): Promise<number> {
  const workers = await em.find(WorkerPresence, { lastSeenAt: { $gt: new Date(now.getTime() - workerAliveMs) } });
  return workers.reduce((sum, worker) => sum + worker.threads, 0);
}
