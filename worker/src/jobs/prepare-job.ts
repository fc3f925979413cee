import { LockMode } from '@mikro-orm/postgresql';
import { countSliceSubsets } from '../../../shared/math/combinations.js';
import { settingsOfSweep } from '../../../shared/sweeps/frozen-settings.js';
import { planShards } from '../../../shared/sweeps/shard-plan.js';
import { emptyLeaderboard } from '../../../shared/sweeps/stored-leaderboard.js';
import { Shard } from '../../../api/src/entities/shard.js';
import { Sweep } from '../../../api/src/entities/sweep.js';
import { notifySweepEvent } from '../../../api/src/live/sweep-events.js';
import { sweepQueueNames, type PrepareJob } from '../../../api/src/queue/sweep-jobs.js';
import { sendInTransaction } from '../../../api/src/queue/transactional-send.js';
import { measuredThroughput } from '../../../api/src/sweeps/measured-throughput.js';
import { loadSignalRecordings } from '../../../api/src/recordings/signal-recordings.js';
import { failSweep } from '../sweeps/sweep-failure.js';
import type { JobContext } from './job-context.js';

/**
 * Prepare (design step 2): signals, regression system and the scaled Gram problem from the stored
 * recordings (on the step thread); stores what shards need on the sweep, cuts the rank space into shards and
 * enqueues them, all in one transaction. A sweep that is no longer queued (cancelled, or prepared by an
 * earlier attempt) is left alone. Input the engine refuses fails the sweep with the engine's message.
 */
export async function runPrepareJob(ctx: JobContext, job: PrepareJob): Promise<void> {
  const em = ctx.orm.em.fork();
  const sweep = await em.findOne(Sweep, { id: job.sweepId });
  if (!sweep || sweep.state !== 'queued') return;
  const answer = await ctx.steps.prepare(settingsOfSweep(sweep.description), await loadSignalRecordings(em, sweep.description));
  if ('refused' in answer) {
    await failSweep(ctx, sweep.id, answer.refused);
    return;
  }
  const prepared = answer.ok;
  const shards = planShards(prepared.candidateCount, prepared.meta.sizes, await measuredThroughput(em), {
    targetSeconds: ctx.config.shardSeconds,
    subsetsPerShard: ctx.config.shardSubsets,
  });

  await ctx.orm.em.fork().transactional(async (tx) => {
    const locked = await tx.findOne(Sweep, { id: job.sweepId }, { lockMode: LockMode.PESSIMISTIC_WRITE });
    if (!locked || locked.state !== 'queued') return;
    Object.assign(locked, {
      state: 'running',
      startedAt: new Date(),
      problemMeta: prepared.meta,
      problemData: Buffer.from(prepared.data),
      candidateCount: prepared.candidateCount,
      rowCount: prepared.rowCount,
      totalSubsets: prepared.total,
      excluded: prepared.excluded,
      warnings: [...new Set([...locked.warnings, ...prepared.warnings])],
      shardCount: shards.length,
      leaderboard: emptyLeaderboard(),
    });
    const created = shards.map((slices, index) => tx.create(Shard, { sweep: locked, index, slices, subsets: countSliceSubsets(slices), state: 'queued' }));
    await tx.flush();
    for (const shard of created) {
      await sendInTransaction(ctx.boss, tx, sweepQueueNames.shard, { kind: 'shard', sweepId: locked.id, shardId: shard.id }, {
        retryLimit: ctx.config.shardRetries,
        retryDelay: 1,
        expireInSeconds: ctx.config.shardExpireSeconds,
      });
    }
    // Delivered at commit, in this order: every planned shard, then the change to running.
    await notifySweepEvent(tx, { kind: 'planned', sweepId: locked.id, teamId: locked.team.id });
    await notifySweepEvent(tx, { kind: 'state', sweepId: locked.id, teamId: locked.team.id, state: 'running' });
  });
  ctx.logger.info({ sweepId: job.sweepId, shards: shards.length, subsets: prepared.total, candidates: prepared.candidateCount }, 'sweep prepared');
}
