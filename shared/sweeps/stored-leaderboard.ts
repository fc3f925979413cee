import { mergeSweepOutcomes } from '../math/leaderboard.js';
import type { GramProblem, RankedSubset, SweepOutcome } from '../math/sweep-problem.js';
import { subsetCoefficients } from './subset-coefficients.js';

/** A leaderboard subset with its coefficients (original units, known columns first), as stored on the sweep. */
export interface StoredEntry extends RankedSubset {
  coefficients: number[];
}

/** A sweep's merged leaderboard: best overall and per size (keys are sizes), each best first. */
export interface StoredLeaderboard {
  best: StoredEntry[];
  bestBySize: Record<string, StoredEntry[]>;
}

export function emptyLeaderboard(): StoredLeaderboard {
  return { best: [], bestBySize: {} };
}

/** A shard's outcome with coefficients worked out for the entries it puts forward. */
export function withCoefficients(outcome: SweepOutcome, problem: GramProblem, scales: readonly number[]): StoredLeaderboard {
  const cache = new Map<string, StoredEntry>();
  const entry = (subset: RankedSubset): StoredEntry => {
    const key = subset.members.join(',');
    let stored = cache.get(key);
    if (!stored) {
      stored = { size: subset.size, members: [...subset.members], rss: subset.rss, coefficients: subsetCoefficients(problem, scales, subset) };
      cache.set(key, stored);
    }
    return stored;
  };
  const bestBySize: Record<string, StoredEntry[]> = {};
  for (const [size, list] of Object.entries(outcome.bestBySize)) bestBySize[size] = list.map(entry);
  return { best: outcome.best.map(entry), bestBySize };
}

/** The leaderboard as a sweep outcome (counts given), the form the merge and the finish step take. */
export function leaderboardOutcome(board: StoredLeaderboard, counts: { evaluated: number; rejected: number }): SweepOutcome {
  const bestBySize: Record<number, RankedSubset[]> = {};
  for (const [size, list] of Object.entries(board.bestBySize)) bestBySize[Number(size)] = list;
  return { evaluated: counts.evaluated, rejected: counts.rejected, stopped: false, best: board.best, bestBySize };
}

/**
 * Merges a shard's entries into the sweep's leaderboard under the kernel's total order (ties broken by
 * membership), so the result does not depend on the order shards arrive in.
 */
export function mergeLeaderboards(current: StoredLeaderboard, shard: StoredLeaderboard, top: number): StoredLeaderboard {
  const merged = mergeSweepOutcomes([leaderboardOutcome(current, { evaluated: 0, rejected: 0 }), leaderboardOutcome(shard, { evaluated: 0, rejected: 0 })], top);
  const bestBySize: Record<string, StoredEntry[]> = {};
  for (const [size, list] of Object.entries(merged.bestBySize)) bestBySize[size] = list as StoredEntry[];
  return { best: merged.best as StoredEntry[], bestBySize };
}
