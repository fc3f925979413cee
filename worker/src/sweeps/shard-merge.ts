import { LockMode } from '@mikro-orm/postgresql';
import type { SweepOutcome } from '../../../shared/math/sweep-problem.js';
import { mergeLeaderboards, type StoredLeaderboard, emptyLeaderboard } from '../../../shared/sweeps/stored-leaderboard.js';
import { Shard } from '../../../api/src/entities/shard.js';
import { Sweep } from '../../../api/src/entities/sweep.js';
import { notifySweepEvent } from '../../../api/src/live/sweep-events.js';
import { sweepJobDefaults, sweepQueueNames } from '../../../api/src/queue/sweep-jobs.js';
import { sendInTransaction } from '../../../api/src/queue/transactional-send.js';
import { cpuSecondsUsed, readAllowance } from '../../../api/src/sweeps/allowance-ledger.js';
import { endSweep } from '../../../api/src/sweeps/sweep-end.js';
import { allowanceDefaultsFrom } from '../../../api/src/config.js';
import type { JobContext } from '../jobs/job-context.js';
import { recordThroughput } from './throughput-record.js';

export interface ShardResult {
  shardId: string;
  sweepId: string;
  outcome: SweepOutcome;
  board: StoredLeaderboard;
  cpuSeconds: number;
  /** True when every subset of the shard was evaluated; false when the sweep's end stopped it. */
  complete: boolean;
}

/**
 * Merges a shard into its sweep in one transaction with the sweep's row locked. The usage ledger has one row
 * per shard (unique shard id): when the insert finds the row already there, an earlier run of this shard was
 * merged and nothing more happens, so a shard that runs twice counts once. Charges the CPU seconds, halts the
 * sweep when the team's monthly allowance is now exceeded, and enqueues the finish step after the last shard.
 */
export async function mergeShard(ctx: JobContext, result: ShardResult): Promise<'merged' | 'duplicate' | 'gone'> {
  return ctx.orm.em.fork().transactional(async (tx) => {
    const sweep = await tx.findOne(Sweep, { id: result.sweepId }, { lockMode: LockMode.PESSIMISTIC_WRITE });
    const shard = await tx.findOne(Shard, { id: result.shardId });
    if (!sweep || !shard) return 'gone';
    const inserted = await tx.execute<{ id: string }[]>(
      `insert into usage_charge (id, team_id, sweep_id, shard_id, cpu_seconds, subsets, charged_at)
       values (gen_random_uuid(), ?, ?, ?, ?, ?, now()) on conflict (shard_id) do nothing returning id`,
      [sweep.team.id, sweep.id, shard.id, result.cpuSeconds, result.outcome.evaluated + result.outcome.rejected],
    );
    if (inserted.length === 0) return 'duplicate';

    const now = new Date();
    Object.assign(shard, {
      state: result.complete ? 'done' : 'cancelled',
      evaluated: result.outcome.evaluated,
      rejected: result.outcome.rejected,
      cpuSeconds: result.cpuSeconds,
      endedAt: now,
    });
    const top = sweep.description.settings.top;
    Object.assign(sweep, {
      evaluated: sweep.evaluated + result.outcome.evaluated,
      rejected: sweep.rejected + result.outcome.rejected,
      cpuSeconds: sweep.cpuSeconds + result.cpuSeconds,
      shardsDone: sweep.shardsDone + (result.complete ? 1 : 0),
      leaderboard: mergeLeaderboards(sweep.leaderboard ?? emptyLeaderboard(), result.board, top),
      leaderboardVersion: sweep.leaderboardVersion + 1,
    });
    await tx.flush();
    if (result.complete) await recordThroughput(tx, shard.slices, result.cpuSeconds);

    if (sweep.state === 'running') {
      const limits = await readAllowance(tx, sweep.team.id, allowanceDefaultsFrom(process.env));
      const used = await cpuSecondsUsed(tx, sweep.team.id, now);
      if (used >= limits.cpuSecondsPerMonth) {
        await endSweep(tx, ctx.boss, sweep, {
          state: 'halted',
          reason: `The team's allowance of ${limits.cpuSecondsPerMonth.toLocaleString('en-US')} CPU seconds this month is used up (${used.toFixed(1)} used); the results so far are kept.`,
        });
      } else if (sweep.shardsDone === sweep.shardCount) {
        await sendInTransaction(ctx.boss, tx, sweepQueueNames.finish, { kind: 'finish', sweepId: sweep.id }, { ...sweepJobDefaults.finish, singletonKey: sweep.id });
      }
    }
    await notifySweepEvent(tx, { kind: 'shard', sweepId: sweep.id, teamId: sweep.team.id, shardId: shard.id });
    await notifySweepEvent(tx, { kind: 'leaderboard', sweepId: sweep.id, teamId: sweep.team.id, version: sweep.leaderboardVersion });
    return 'merged';
  });
}
