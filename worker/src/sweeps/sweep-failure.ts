import { LockMode } from '@mikro-orm/postgresql';
import { Sweep } from '../../../api/src/entities/sweep.js';
import { endSweep } from '../../../api/src/sweeps/sweep-end.js';
import type { JobContext } from '../jobs/job-context.js';

/** Marks a sweep failed with a reason people can act on, unless it has ended already. */
export async function failSweep(ctx: JobContext, sweepId: string, reason: string): Promise<void> {
  await ctx.orm.em.fork().transactional(async (tx) => {
    const sweep = await tx.findOne(Sweep, { id: sweepId }, { lockMode: LockMode.PESSIMISTIC_WRITE });
    if (!sweep || (sweep.state !== 'queued' && sweep.state !== 'running')) return;
    await endSweep(tx, ctx.boss, sweep, { state: 'failed', reason });
  });
  ctx.logger.warn({ sweepId, reason }, 'sweep failed');
}
