import type { EntityManager } from '@mikro-orm/postgresql';
import { safetyCaution } from '../../../shared/model/safety-caution.js';
import type { ShardSummary, SweepDetail, SweepSummary } from '../../../shared/schemas/sweep.js';
import type { SweepLeaderboard } from '../../../shared/schemas/sweep-leaderboard.js';
import { leaderboardEntries } from '../../../shared/sweeps/leaderboard-view.js';
import { Shard } from '../entities/shard.js';
import { Sweep } from '../entities/sweep.js';

const iso = (date: Date | null | undefined) => (date ? date.toISOString() : null);

function bestOf(sweep: Sweep): SweepSummary['best'] {
  const result = sweep.result;
  if (result && typeof result === 'object' && 'best' in result && result.best && result.models[0]) {
    return { terms: result.best.terms, energy: result.best.energy, rss: result.models[0].rss };
  }
  const first = sweep.leaderboard?.best[0];
  if (!first || !sweep.problemMeta) return null;
  const [entry] = leaderboardEntries(sweep.problemMeta, sweep.description.coordinates, [first]);
  return entry ? { terms: entry.terms, energy: entry.energy, rss: entry.rss } : null;
}

export function toSweepSummary(sweep: Sweep): SweepSummary {
  return {
    id: sweep.id,
    projectId: sweep.project.id,
    teamId: sweep.team.id,
    name: sweep.name,
    state: sweep.state,
    stateReason: sweep.stateReason ?? null,
    candidateSet: { id: sweep.candidateSetId ?? null, name: sweep.candidateSetName },
    launchedBy: { id: sweep.launchedById, name: sweep.launchedByName },
    launchedAt: sweep.launchedAt.toISOString(),
    startedAt: iso(sweep.startedAt),
    endedAt: iso(sweep.endedAt),
    cancelledBy: sweep.cancelledById ? { id: sweep.cancelledById, name: sweep.cancelledByName ?? '' } : null,
    cancelledAt: iso(sweep.cancelledAt),
    totalSubsets: sweep.totalSubsets,
    evaluated: sweep.evaluated,
    rejected: sweep.rejected,
    cpuSeconds: sweep.cpuSeconds,
    estimatedCpuSeconds: sweep.estimatedCpuSeconds,
    shardCount: sweep.shardCount,
    shardsDone: sweep.shardsDone,
    best: bestOf(sweep),
  };
}

export function toShardSummary(shard: Shard): ShardSummary {
  return {
    id: shard.id,
    index: shard.index,
    slices: shard.slices,
    subsets: shard.subsets,
    state: shard.state,
    attempts: shard.attempts,
    worker: shard.worker ?? null,
    evaluated: shard.evaluated,
    rejected: shard.rejected,
    cpuSeconds: shard.cpuSeconds,
    startedAt: iso(shard.startedAt),
    endedAt: iso(shard.endedAt),
  };
}

/** A sweep as stored now, with the lazy result loaded (it carries the chosen best model once finished). */
export async function loadSweepForView(em: EntityManager, where: { id: string; team?: string }): Promise<Sweep | null> {
  return em.findOne(Sweep, where, { populate: ['result'], refresh: true });
}

export async function toSweepDetail(em: EntityManager, sweep: Sweep): Promise<SweepDetail> {
  const shards = await em.find(Shard, { sweep: sweep.id }, { orderBy: { index: 'asc' }, refresh: true });
  return {
    ...toSweepSummary(sweep),
    description: sweep.description,
    candidateCount: sweep.candidateCount ?? null,
    excluded: sweep.excluded,
    warnings: sweep.warnings,
    shards: shards.map(toShardSummary),
  };
}

export function toSweepLeaderboard(sweep: Sweep): SweepLeaderboard {
  const board = sweep.leaderboard;
  const meta = sweep.problemMeta;
  const entries = (list: Parameters<typeof leaderboardEntries>[2]) => (meta ? leaderboardEntries(meta, sweep.description.coordinates, list) : []);
  const result = sweep.result && typeof sweep.result === 'object' && 'models' in sweep.result ? sweep.result : null;
  return {
    sweepId: sweep.id,
    state: sweep.state,
    version: sweep.leaderboardVersion,
    evaluated: sweep.evaluated,
    rejected: sweep.rejected,
    totalSubsets: sweep.totalSubsets,
    rowCount: sweep.rowCount ?? null,
    overall: board ? entries(board.best) : [],
    bySize: board
      ? Object.entries(board.bestBySize)
          .map(([size, list]) => ({ size: Number(size), entries: entries(list) }))
          .sort((a, b) => a.size - b.size)
      : [],
    result,
    caution: safetyCaution,
  };
}
