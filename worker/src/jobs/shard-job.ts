import { LockMode } from '@mikro-orm/postgresql';
import type { SweepProgress } from '../../../shared/math/sweep-problem.js';
import { decodeProblem } from '../../../shared/sweeps/problem-encoding.js';
import { withCoefficients } from '../../../shared/sweeps/stored-leaderboard.js';
import { Shard } from '../../../api/src/entities/shard.js';
import { Sweep } from '../../../api/src/entities/sweep.js';
import { notifySweepEvent } from '../../../api/src/live/sweep-events.js';
import type { ShardJob } from '../../../api/src/queue/sweep-jobs.js';
import { createStopFlag, requestStop } from '../pool/sweep-pool.js';
import type { MeasuredSweep } from '../pool/sweep-task.js';
import { mergeShard } from '../sweeps/shard-merge.js';
import type { JobContext } from './job-context.js';

/** Stop this long before pg-boss's expiry, so the thread is free when the job is handed out again. */
const EXPIRY_MARGIN_MS = 1000;

interface Claim {
  sweepId: string;
  teamId: string;
  slices: Shard['slices'];
  top: number;
}

/** Takes the shard for this worker, or says why not (done already, or its sweep is no longer running). */
async function claimShard(ctx: JobContext, job: ShardJob): Promise<Claim | null> {
  return ctx.orm.em.fork().transactional(async (tx) => {
    const shard = await tx.findOne(Shard, { id: job.shardId }, { lockMode: LockMode.PESSIMISTIC_WRITE });
    const sweep = await tx.findOne(Sweep, { id: job.sweepId });
    if (!shard || !sweep || shard.state === 'done' || shard.state === 'cancelled' || shard.state === 'failed') return null;
    if (sweep.state !== 'running') {
      Object.assign(shard, { state: 'cancelled', endedAt: new Date() });
      await tx.flush();
      await notifySweepEvent(tx, { kind: 'shard', sweepId: sweep.id, teamId: sweep.team.id, shardId: shard.id });
      return null;
    }
    // A shard found "running" was held by a worker that died or ran past the expiry: this is its next run.
    Object.assign(shard, { state: 'running', attempts: shard.attempts + 1, worker: ctx.config.name, startedAt: new Date(), endedAt: null });
    await tx.flush();
    await notifySweepEvent(tx, { kind: 'shard', sweepId: sweep.id, teamId: sweep.team.id, shardId: shard.id });
    return { sweepId: sweep.id, teamId: sweep.team.id, slices: shard.slices, top: sweep.description.settings.top };
  });
}

/** Puts a shard whose run failed back to queued (its job is retried), unless another run took it since. */
async function releaseShard(ctx: JobContext, shardId: string): Promise<void> {
  await ctx.orm.em.fork().nativeUpdate(Shard, { id: shardId, state: 'running', worker: ctx.config.name }, { state: 'queued' });
}

/**
 * A shard (design step 3): evaluates its rank ranges on one pool thread with a stop flag. While it runs, a
 * tick at least every CONSERVA_PROGRESS_MS publishes the counters (NOTIFY) and reads the sweep's state: a
 * cancelled or halted sweep raises the stop flag and the thread stops within the kernel's checkpoint. The
 * tick also stops the run just before pg-boss's expiry, since pg-boss hands an expired job out again. A run
 * that completed, or stopped because its sweep ended, is merged (partial results are kept); one stopped by
 * the expiry is not (its next run redoes it).
 */
export async function runShardJob(ctx: JobContext, job: ShardJob, startedAt = Date.now()): Promise<void> {
  const claim = await claimShard(ctx, job);
  if (!claim) return;
  const em = ctx.orm.em.fork();
  const sweep = await em.findOneOrFail(Sweep, { id: claim.sweepId }, { populate: ['problemData'] });
  const problem = decodeProblem(sweep.problemMeta!, sweep.problemData!);

  const stopFlag = createStopFlag();
  let stopReason: 'ended' | 'expired' | 'shutdown' | null = null;
  let latest: SweepProgress = { evaluated: 0, rejected: 0 };
  const runStarted = performance.now();
  const deadline = startedAt + ctx.config.shardExpireSeconds * 1000 - EXPIRY_MARGIN_MS;
  let ticking = false;
  const tick = async () => {
    if (ticking) return;
    ticking = true;
    try {
      const elapsed = (performance.now() - runStarted) / 1000;
      await notifySweepEvent(em, { kind: 'progress', sweepId: claim.sweepId, teamId: claim.teamId, shardId: job.shardId, ...latest, elapsed });
      const [row] = await em.execute<{ state: string }[]>('select state from sweep where id = ?', [claim.sweepId]);
      if (!stopReason && row?.state !== 'running') {
        stopReason = 'ended';
        requestStop(stopFlag);
      }
    } catch (err) {
      ctx.logger.warn({ err, shardId: job.shardId }, 'progress tick failed');
    } finally {
      ticking = false;
    }
    if (!stopReason && Date.now() >= deadline) {
      stopReason = 'expired';
      requestStop(stopFlag);
    }
  };
  const timer = setInterval(() => void tick(), ctx.config.progressMs);
  const stopForShutdown = () => {
    stopReason ??= 'shutdown';
    requestStop(stopFlag);
  };
  ctx.runningShards.add(stopForShutdown);

  let measured: MeasuredSweep;
  try {
    measured = await ctx.pool.runSlices(problem, claim.slices, {
      top: claim.top,
      stopFlag,
      progressIntervalMs: Math.min(250, ctx.config.progressMs),
      onProgress: (progress) => {
        latest = progress;
      },
    });
  } catch (error) {
    await releaseShard(ctx, job.shardId);
    throw error;
  } finally {
    clearInterval(timer);
    ctx.runningShards.delete(stopForShutdown);
  }
  const { outcome, cpuSeconds } = measured;

  if ((stopReason === 'expired' || stopReason === 'shutdown') && outcome.stopped) {
    await releaseShard(ctx, job.shardId);
    throw new Error(`shard ${job.shardId} was stopped (${stopReason === 'expired' ? `its expiry of ${ctx.config.shardExpireSeconds} s came` : 'the worker is stopping'}) and will run again`);
  }
  const board = withCoefficients(outcome, problem, sweep.problemMeta!.scales);
  const merged = await mergeShard(ctx, { shardId: job.shardId, sweepId: claim.sweepId, outcome, board, cpuSeconds, complete: !outcome.stopped });
  ctx.logger.info(
    { sweepId: claim.sweepId, shardId: job.shardId, evaluated: outcome.evaluated, rejected: outcome.rejected, cpuSeconds, stopped: outcome.stopped, merged },
    outcome.stopped ? 'shard stopped' : 'shard done',
  );
}
