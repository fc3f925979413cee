import type { EntityManager } from '@mikro-orm/postgresql';
import type { LiveProgress, LiveServerMessage } from '../../../shared/schemas/live-message.js';
import { endedSweepStates, type SweepState } from '../../../shared/schemas/sweep.js';
import { Shard } from '../entities/shard.js';
import type { Sweep } from '../entities/sweep.js';
import { loadSweepForView, toShardSummary, toSweepLeaderboard, toSweepSummary } from '../sweeps/sweep-views.js';

/** Subsets per second are measured over this window. */
const rateWindowMs = 5000;

interface RunningShard {
  evaluated: number;
  rejected: number;
  /** Seconds the shard has run on its thread so far. */
  seconds: number;
}

/**
 * The live state of one watched sweep: the merged counts (subsets, shards, CPU seconds) from the database plus
 * the counters running shards published, and the recent rate. Turns worker events into client messages; reads the database for anything
 * beyond counters, so what it sends is what a fresh GET would show.
 */
export class SweepFeed {
  private state: SweepState = 'queued';
  private merged = { evaluated: 0, rejected: 0, cpuSeconds: 0 };
  private shards = { done: 0, count: 0 };
  private totalSubsets = 0;
  private startedAt: Date | null = null;
  private readonly running = new Map<string, RunningShard>();
  /** Shards that merged or stopped: late progress from them is stale and ignored. */
  private readonly settled = new Set<string>();
  private readonly samples: { at: number; covered: number }[] = [];
  lastProgressAt = 0;

  constructor(
    readonly sweepId: string,
    readonly teamId: string,
  ) {}

  get isRunning(): boolean {
    return this.state === 'running';
  }

  /** Takes the sweep's stored counts and state as the new base. */
  rebase(sweep: Sweep): void {
    this.state = sweep.state;
    this.merged = { evaluated: sweep.evaluated, rejected: sweep.rejected, cpuSeconds: sweep.cpuSeconds };
    this.shards = { done: sweep.shardsDone, count: sweep.shardCount };
    this.totalSubsets = sweep.totalSubsets;
    this.startedAt = sweep.startedAt ?? null;
    if (endedSweepStates.includes(sweep.state)) this.running.clear();
  }

  /** A running shard's counters; false when they are stale. */
  noteProgress(shardId: string, counts: RunningShard): boolean {
    if (this.settled.has(shardId)) return false;
    this.running.set(shardId, counts);
    return true;
  }

  progress(now = Date.now()): LiveProgress {
    let evaluated = this.merged.evaluated;
    let rejected = this.merged.rejected;
    let cpuSeconds = this.merged.cpuSeconds;
    for (const shard of this.running.values()) {
      evaluated += shard.evaluated;
      rejected += shard.rejected;
      cpuSeconds += shard.seconds;
    }
    const covered = evaluated + rejected;
    this.samples.push({ at: now, covered });
    while (this.samples.length > 2 && this.samples[0]!.at < now - rateWindowMs) this.samples.shift();
    const first = this.samples[0]!;
    const seconds = (now - first.at) / 1000;
    const rate = seconds >= 0.5 && covered >= first.covered ? (covered - first.covered) / seconds : null;
    const remaining = Math.max(0, this.totalSubsets - covered);
    this.lastProgressAt = now;
    return {
      type: 'progress',
      sweepId: this.sweepId,
      state: this.state,
      evaluated,
      rejected,
      totalSubsets: this.totalSubsets,
      runningShards: this.running.size,
      subsetsPerSecond: rate,
      etaSeconds: rate && rate > 0 ? remaining / rate : remaining === 0 ? 0 : null,
      elapsedSeconds: this.startedAt ? Math.max(0, (now - this.startedAt.getTime()) / 1000) : 0,
      shardsDone: this.shards.done,
      shardCount: this.shards.count,
      cpuSeconds,
      at: new Date(now).toISOString(),
    };
  }

  /** After the prepare step: every planned shard, so a watcher has the whole shard map at once. */
  async shardsPlanned(em: EntityManager): Promise<LiveServerMessage[]> {
    const sweep = await loadSweepForView(em, { id: this.sweepId });
    if (!sweep) return [];
    this.rebase(sweep);
    const shards = await em.find(Shard, { sweep: this.sweepId }, { orderBy: { index: 'asc' }, refresh: true });
    return [{ type: 'shards', sweepId: this.sweepId, shards: shards.map(toShardSummary) }];
  }

  /** After a shard changed state: its summary, and the base counts again (a merge changed them). */
  async shardChanged(em: EntityManager, shardId: string): Promise<LiveServerMessage[]> {
    const shard = await em.findOne(Shard, { id: shardId }, { refresh: true });
    const sweep = await loadSweepForView(em, { id: this.sweepId });
    if (!shard || !sweep) return [];
    if (shard.state === 'running') {
      this.settled.delete(shardId);
    } else {
      this.settled.add(shardId);
      this.running.delete(shardId);
    }
    this.rebase(sweep);
    return [{ type: 'shards', sweepId: this.sweepId, shards: [toShardSummary(shard)] }];
  }

  async leaderboardChanged(em: EntityManager): Promise<LiveServerMessage[]> {
    const sweep = await loadSweepForView(em, { id: this.sweepId });
    if (!sweep) return [];
    this.rebase(sweep);
    return [{ type: 'leaderboard', sweepId: this.sweepId, leaderboard: toSweepLeaderboard(sweep) }];
  }

  async stateChanged(em: EntityManager): Promise<LiveServerMessage[]> {
    const sweep = await loadSweepForView(em, { id: this.sweepId });
    if (!sweep) return [];
    this.rebase(sweep);
    const summary = toSweepSummary(sweep);
    const ended = endedSweepStates.includes(sweep.state);
    return [this.progress(), { type: ended ? 'ended' : 'sweep', sweepId: this.sweepId, sweep: summary }];
  }
}
