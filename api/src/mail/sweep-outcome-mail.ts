import type { SweepSummary } from '../../../shared/schemas/sweep.js';
import type { OutgoingMail } from './sweep-mailer.js';

const count = (value: number) => Math.round(value).toLocaleString('en-US');

function outcomeLine(sweep: SweepSummary): string {
  switch (sweep.state) {
    case 'finished':
      return 'finished';
    case 'cancelled':
      return `was cancelled by ${sweep.cancelledBy?.name ?? 'someone'}`;
    case 'halted':
      return "was halted: the team's monthly CPU allowance ran out";
    case 'failed':
      return 'failed';
    default:
      return `is ${sweep.state}`;
  }
}

/** Where the sweep is shown in the web app. */
export function sweepLink(publicUrl: string, sweep: Pick<SweepSummary, 'id' | 'projectId'>): string {
  return new URL(`projects/${sweep.projectId}/sweeps/${sweep.id}`, publicUrl).href;
}

/** The e-mail to the launcher when a sweep ends: outcome, best model's energy, counts and a link. */
export function sweepOutcomeMail(sweep: SweepSummary, to: string, publicUrl: string): OutgoingMail {
  const outcome = outcomeLine(sweep);
  const lines = [
    `Your sweep "${sweep.name}" ${outcome}.`,
    '',
    ...(sweep.stateReason ? [`Reason: ${sweep.stateReason}`, ''] : []),
    sweep.best
      ? `Best model${sweep.state === 'finished' ? '' : ' so far'}: E = ${sweep.best.energy}`
      : 'No model was found before it ended.',
    ...(sweep.best ? [`Terms: ${sweep.best.terms.join(', ')}`, `Residual sum of squares: ${sweep.best.rss.toPrecision(6)}`] : []),
    '',
    `Subsets evaluated: ${count(sweep.evaluated)} of ${count(sweep.totalSubsets)} (${count(sweep.rejected)} rejected as rank deficient)`,
    `CPU seconds used: ${sweep.cpuSeconds.toFixed(1)}`,
    `Shards done: ${sweep.shardsDone} of ${sweep.shardCount}`,
    '',
    `Open the sweep: ${sweepLink(publicUrl, sweep)}`,
  ];
  const subjects: Record<string, string> = {
    finished: `Sweep "${sweep.name}" finished`,
    cancelled: `Sweep "${sweep.name}" was cancelled`,
    halted: `Sweep "${sweep.name}" halted: allowance used up`,
    failed: `Sweep "${sweep.name}" failed`,
  };
  return { to, subject: subjects[sweep.state] ?? `Sweep "${sweep.name}" ${outcome}`, text: lines.join('\n') };
}
