import { Shard } from '../../../api/src/entities/shard.js';
import type { SweepJob } from '../../../api/src/queue/sweep-jobs.js';
import { failSweep } from '../sweeps/sweep-failure.js';
import type { JobContext } from './job-context.js';

const what: Record<SweepJob['kind'], string> = {
  prepare: 'The prepare step',
  shard: 'A shard',
  finish: 'The finish step',
  ended: 'The e-mail step',
};

/** A job that failed past its retries (or whose workers kept dying): its sweep fails, saying which step. */
export async function runDeadLetterJob(ctx: JobContext, job: SweepJob): Promise<void> {
  if (job.kind === 'ended') {
    ctx.logger.error({ sweepId: job.sweepId }, 'the sweep e-mail could not be sent after retries');
    return;
  }
  if (job.kind === 'shard') await ctx.orm.em.fork().nativeUpdate(Shard, { id: job.shardId, state: { $ne: 'done' } }, { state: 'failed', endedAt: new Date() });
  await failSweep(ctx, job.sweepId, `${what[job.kind]} failed on every attempt (the workers' logs say why); the results so far are kept.`);
}
