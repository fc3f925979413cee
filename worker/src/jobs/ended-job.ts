import { Sweep } from '../../../api/src/entities/sweep.js';
import { sweepOutcomeMail } from '../../../api/src/mail/sweep-outcome-mail.js';
import type { EndedJob } from '../../../api/src/queue/sweep-jobs.js';
import { loadSweepForView, toSweepSummary } from '../../../api/src/sweeps/sweep-views.js';
import type { JobContext } from './job-context.js';

/**
 * Tells the launcher that the sweep ended (finished, failed, halted, or cancelled by someone else): one
 * e-mail with the outcome, the best model's energy, the counts and a link. `notifiedAt` makes it once only,
 * however often the job runs; someone who cancelled their own sweep gets no e-mail.
 */
export async function runEndedJob(ctx: JobContext, job: EndedJob): Promise<void> {
  const em = ctx.orm.em.fork();
  const sweep = await loadSweepForView(em, { id: job.sweepId });
  if (!sweep || sweep.notifiedAt || sweep.state === 'queued' || sweep.state === 'running') return;
  const ownCancel = sweep.state === 'cancelled' && sweep.cancelledById === sweep.launchedById;
  if (!ownCancel) {
    const mail = sweepOutcomeMail(toSweepSummary(sweep), sweep.launchedByEmail, ctx.config.publicUrl);
    await ctx.mailer.send(mail);
    ctx.logger.info({ sweepId: sweep.id, to: mail.to, subject: mail.subject }, 'sweep e-mail sent');
  }
  await em.nativeUpdate(Sweep, { id: sweep.id }, { notifiedAt: new Date() });
}
