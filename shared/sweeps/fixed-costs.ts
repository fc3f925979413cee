import type { EstimateBasis } from '../schemas/sweep.js';

/*
 * A sweep's wall time is more than its subsets: the prepare step (signals, regression rows, Gram matrix, shard
 * plan), each shard's handling (taking the job, reading the problem, merging into the leaderboard), and the
 * finish step (re-fit, Legendre step) come on top, and they dominate small sweeps. Each finished sweep records
 * what these took on this installation (SweepTiming); estimates use the medians of the latest ones.
 */

/** The fixed costs of one sweep, in wall seconds. */
export interface FixedCosts {
  /** From launch until the shards are planned (the prepare job's wait in its queue, and its work). */
  prepareSeconds: number;
  /** Per shard and thread, beyond the shard's CPU seconds. */
  shardOverheadSeconds: number;
  /** From the last shard's merge until the sweep is finished (the finish job's wait, and its work). */
  finishSeconds: number;
}

/**
 * Until a sweep has finished on this installation: our measurements on the development machine (2 cores,
 * demo and test sweeps), rounded up. Prepare and finish took 1 to 2 s and under 1 s; workers take a shard job
 * at most every half second per thread (their queue polling), which dominated the shards' handling.
 */
export const DEFAULT_FIXED_COSTS: FixedCosts = { prepareSeconds: 2, shardOverheadSeconds: 0.5, finishSeconds: 2 };

/** The estimate uses this many of the latest finished sweeps. */
export const FIXED_COST_SWEEPS = 20;

function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1 ? sorted[middle]! : (sorted[middle - 1]! + sorted[middle]!) / 2;
}

/**
 * The fixed costs to expect: the medians of the latest finished sweeps (a median, so one sweep that waited in
 * the queue for a worker does not move it), or the defaults until one has finished; with what they rest on.
 */
export function expectedFixedCosts(latest: readonly FixedCosts[]): { costs: FixedCosts; basis: EstimateBasis } {
  if (latest.length === 0) {
    return {
      costs: DEFAULT_FIXED_COSTS,
      basis: {
        source: 'default',
        samples: 0,
        text: `default until measured: ${DEFAULT_FIXED_COSTS.prepareSeconds} s to prepare, ${DEFAULT_FIXED_COSTS.shardOverheadSeconds} s per shard, ${DEFAULT_FIXED_COSTS.finishSeconds} s to finish`,
      },
    };
  }
  return {
    costs: {
      prepareSeconds: median(latest.map((s) => s.prepareSeconds)),
      shardOverheadSeconds: median(latest.map((s) => s.shardOverheadSeconds)),
      finishSeconds: median(latest.map((s) => s.finishSeconds)),
    },
    basis: {
      source: 'measured',
      samples: latest.length,
      text: `measured on this installation over the last ${latest.length === 1 ? 'sweep' : `${latest.length} sweeps`}`,
    },
  };
}

/**
 * The handling of one shard beyond its CPU seconds, from a finished sweep: the shards ran on `threads` threads
 * at once (no more than there were shards) for `phaseSeconds` from the plan to the last merge, of which
 * `cpuSeconds` were charged, so each shard on its thread took (phase x threads - CPU) / shards more.
 */
export function shardOverheadOf(run: { phaseSeconds: number; cpuSeconds: number; shardCount: number; threads: number }): number {
  if (run.shardCount <= 0) return 0;
  const threads = Math.max(1, Math.min(run.threads, run.shardCount));
  return Math.max(0, (run.phaseSeconds * threads - run.cpuSeconds) / run.shardCount);
}

/**
 * Expected wall time of a sweep on `threads` worker threads: prepare, then the shards spread over the threads
 * (no more threads than shards work at once), each with its CPU seconds and its handling, then finish. Null
 * when no worker runs.
 */
export function expectedWallSeconds(sweep: { cpuSeconds: number; shardCount: number; threads: number }, costs: FixedCosts): number | null {
  if (sweep.threads <= 0) return null;
  const working = Math.max(1, Math.min(sweep.threads, sweep.shardCount));
  const shards = (sweep.cpuSeconds + sweep.shardCount * costs.shardOverheadSeconds) / working;
  return costs.prepareSeconds + shards + costs.finishSeconds;
}
