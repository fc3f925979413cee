import { countSubsetsBySize, partitionSlices, splitRankSpace } from '../math/combinations.js';
import type { SweepSlice } from '../math/sweep-problem.js';
import { subsetsPerCpuSecond, type MeasuredThroughput } from './sweep-estimate.js';

/** CPU seconds a shard is cut to take unless a worker is told otherwise (CONSERVA_SHARD_SECONDS). */
export const DEFAULT_SHARD_SECONDS = 30;

export interface ShardSizing {
  /** CPU seconds a shard should take (production: tens of seconds). */
  targetSeconds: number;
  /** A fixed number of subsets per shard instead (tests use it to get several small shards). */
  subsetsPerShard?: number | null;
}

/**
 * Cuts the rank space of sizes min..max into shards: contiguous runs of slices in size-then-rank order,
 * each with about the same number of subsets, as many as the expected CPU time divided by the target (from
 * measured throughput, else the default rate). Every subset is in exactly one shard.
 */
export function planShards(candidateCount: number, sizes: { min: number; max: number }, measured: MeasuredThroughput, sizing: ShardSizing): SweepSlice[][] {
  const counts = countSubsetsBySize(candidateCount, sizes.min, sizes.max);
  const total = counts.reduce((sum, c) => sum + c.count, 0);
  if (total === 0) return [];
  const cpuSeconds = counts.reduce((sum, c) => sum + c.count / subsetsPerCpuSecond(c.size, measured).rate, 0);
  const shardCount = sizing.subsetsPerShard
    ? Math.ceil(total / sizing.subsetsPerShard)
    : Math.max(1, Math.ceil(cpuSeconds / sizing.targetSeconds));
  return partitionSlices(splitRankSpace(candidateCount, sizes.min, sizes.max, total), Math.min(shardCount, total));
}
