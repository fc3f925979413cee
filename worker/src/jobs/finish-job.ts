import { LockMode } from '@mikro-orm/postgresql';
import { settingsOfSweep } from '../../../shared/sweeps/frozen-settings.js';
import { emptyLeaderboard } from '../../../shared/sweeps/stored-leaderboard.js';
import { Sweep } from '../../../api/src/entities/sweep.js';
import { notifySweepEvent } from '../../../api/src/live/sweep-events.js';
import type { FinishJob } from '../../../api/src/queue/sweep-jobs.js';
import { endSweep } from '../../../api/src/sweeps/sweep-end.js';
import { loadSignalRecordings } from '../../../api/src/recordings/signal-recordings.js';
import { failSweep } from '../sweeps/sweep-failure.js';
import { recordSweepTiming } from '../sweeps/sweep-timing-record.js';
import type { JobContext } from './job-context.js';

/**
 * Finish (design step 5): once every shard has merged, runs the command line's finish step on the merged
 * leaderboard (on the step thread), stores the result in the command line's shape, marks the sweep
 * finished and records what it took beyond its subsets for later estimates. Only a running sweep with every shard merged is finished; anything else leaves the job with
 * nothing to do.
 */
export async function runFinishJob(ctx: JobContext, job: FinishJob): Promise<void> {
  const em = ctx.orm.em.fork();
  const sweep = await em.findOne(Sweep, { id: job.sweepId });
  if (!sweep || sweep.state !== 'running' || sweep.shardsDone < sweep.shardCount) return;
  const seconds = sweep.startedAt ? (Date.now() - sweep.startedAt.getTime()) / 1000 : 0;
  const answer = await ctx.steps.finish(
    settingsOfSweep(sweep.description),
    await loadSignalRecordings(em, sweep.description),
    sweep.leaderboard ?? emptyLeaderboard(),
    { evaluated: sweep.evaluated, rejected: sweep.rejected },
    seconds,
  );
  if ('refused' in answer) {
    await failSweep(ctx, sweep.id, answer.refused);
    return;
  }
  const result = answer.ok;
  await ctx.orm.em.fork().transactional(async (tx) => {
    const locked = await tx.findOne(Sweep, { id: job.sweepId }, { lockMode: LockMode.PESSIMISTIC_WRITE });
    if (!locked || locked.state !== 'running') return;
    locked.result = result;
    locked.leaderboardVersion += 1;
    // Both events are delivered at commit, in this order: the result, then the end.
    await notifySweepEvent(tx, { kind: 'leaderboard', sweepId: locked.id, teamId: locked.team.id, version: locked.leaderboardVersion });
    await endSweep(tx, ctx.boss, locked, { state: 'finished' });
    await recordSweepTiming(tx, locked, locked.endedAt!);
  });
  ctx.logger.info({ sweepId: job.sweepId, best: result.best?.energy ?? null }, 'sweep finished');
}
