import type { EntityManager } from '@mikro-orm/postgresql';
import type { SweepSlice } from '../../../shared/math/sweep-problem.js';

/** Past measurements fade: once a size has this many CPU seconds on record, each new one halves the old. */
const MEMORY_CPU_SECONDS = 600;

/**
 * Adds a finished shard's speed to the measured throughput per size, and counts the shard for each size it
 * measured. A shard's CPU seconds are shared out among its slices by their work, subsets times (size + 2)
 * multiply-adds (the kernel's inner step).
 */
export async function recordThroughput(em: EntityManager, slices: readonly SweepSlice[], cpuSeconds: number): Promise<void> {
  const work = slices.map((s) => (s.endRank - s.firstRank) * (s.size + 2));
  const totalWork = work.reduce((a, b) => a + b, 0);
  if (!(totalWork > 0) || !(cpuSeconds > 0)) return;
  for (const [i, slice] of slices.entries()) {
    const subsets = slice.endRank - slice.firstRank;
    const seconds = (cpuSeconds * work[i]!) / totalWork;
    await em.execute(
      `insert into subset_throughput (size, subsets, cpu_seconds, shards, updated_at) values (?, ?, ?, 1, now())
       on conflict (size) do update set
         subsets = case when subset_throughput.cpu_seconds > ? then subset_throughput.subsets / 2 else subset_throughput.subsets end + excluded.subsets,
         cpu_seconds = case when subset_throughput.cpu_seconds > ? then subset_throughput.cpu_seconds / 2 else subset_throughput.cpu_seconds end + excluded.cpu_seconds,
         shards = case when subset_throughput.cpu_seconds > ? then subset_throughput.shards / 2 else subset_throughput.shards end + 1,
         updated_at = now()`,
      [slice.size, subsets, seconds, MEMORY_CPU_SECONDS, MEMORY_CPU_SECONDS, MEMORY_CPU_SECONDS],
    );
  }
}
