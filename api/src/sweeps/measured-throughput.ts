import type { EntityManager } from '@mikro-orm/postgresql';
import { FIXED_COST_SWEEPS, type FixedCosts } from '../../../shared/sweeps/fixed-costs.js';
import type { ShardSizing } from '../../../shared/sweeps/shard-plan.js';
import type { MeasuredThroughput } from '../../../shared/sweeps/sweep-estimate.js';
import { SubsetThroughput } from '../entities/subset-throughput.js';
import { SweepTiming } from '../entities/sweep-timing.js';
import { WorkerPresence } from '../entities/worker-presence.js';

/** A worker that reported within this many milliseconds counts as running. */
export const workerAliveMs = 30_000;

/** Measured subsets, CPU seconds and shards per size. */
export async function measuredThroughput(em: EntityManager): Promise<MeasuredThroughput> {
  const rows = await em.find(SubsetThroughput, {});
  return new Map(rows.map((row) => [row.size, { subsets: row.subsets, cpuSeconds: row.cpuSeconds, shards: row.shards }]));
}

/** The workers seen lately: their threads, and how the latest of them cuts shards (null when none runs). */
export async function liveWorkers(em: EntityManager, now = new Date()): Promise<{ threads: number; sizing: ShardSizing | null }> {
  const workers = await em.find(WorkerPresence, { lastSeenAt: { $gt: new Date(now.getTime() - workerAliveMs) } }, { orderBy: { lastSeenAt: 'desc' } });
  const latest = workers[0];
  return {
    threads: workers.reduce((sum, worker) => sum + worker.threads, 0),
    sizing: latest ? { targetSeconds: latest.shardSeconds, subsetsPerShard: latest.shardSubsets ?? null } : null,
  };
}

/** The fixed costs the latest finished sweeps measured, newest first. */
export async function latestFixedCosts(em: EntityManager): Promise<FixedCosts[]> {
  const rows = await em.find(SweepTiming, {}, { orderBy: { finishedAt: 'desc' }, limit: FIXED_COST_SWEEPS });
  return rows.map((row) => ({ prepareSeconds: row.prepareSeconds, shardOverheadSeconds: row.shardOverheadSeconds, finishSeconds: row.finishSeconds }));
}
