import type { EntityManager } from '@mikro-orm/postgresql';
import { shardOverheadOf } from '../../../shared/sweeps/fixed-costs.js';
import type { Sweep } from '../../../api/src/entities/sweep.js';

/**
 * Records what a sweep that has just finished took beyond its subsets (table sweep_timing), for the fixed
 * costs of later estimates: launch to plan, plan to the last merge on the threads of the workers that ran its
 * shards, last merge to finish. A worker no longer reporting counts as one thread.
 */
export async function recordSweepTiming(tx: EntityManager, sweep: Sweep, finishedAt: Date): Promise<void> {
  if (!sweep.startedAt) return;
  const [shards] = await tx.execute<{ last: Date | null; workers: string[] | null }[]>(
    'select max(ended_at) as last, array_agg(distinct worker) filter (where worker is not null) as workers from shard where sweep_id = ?',
    [sweep.id],
  );
  const workers = shards?.workers ?? [];
  const known =
    workers.length === 0
      ? []
      : await tx.execute<{ threads: number }[]>('select threads from worker_presence where id in (?)', [workers]);
  const threads = Math.max(1, known.reduce((sum, row) => sum + row.threads, 0) + workers.length - known.length);
  const lastMerge = shards?.last ? new Date(shards.last) : sweep.startedAt;
  const seconds = (from: Date, to: Date) => Math.max(0, (to.getTime() - from.getTime()) / 1000);
  const phaseSeconds = seconds(sweep.startedAt, lastMerge);
  await tx.execute(
    `insert into sweep_timing (sweep_id, finished_at, prepare_seconds, finish_seconds, shard_count, threads, shard_cpu_seconds,
       shard_phase_seconds, shard_overhead_seconds)
     values (?, ?, ?, ?, ?, ?, ?, ?, ?) on conflict (sweep_id) do nothing`,
    [
      sweep.id,
      finishedAt,
      seconds(sweep.launchedAt, sweep.startedAt),
      seconds(lastMerge, finishedAt),
      sweep.shardCount,
      threads,
      sweep.cpuSeconds,
      phaseSeconds,
      shardOverheadOf({ phaseSeconds, cpuSeconds: sweep.cpuSeconds, shardCount: sweep.shardCount, threads }),
    ],
  );
}
