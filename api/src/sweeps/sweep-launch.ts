import { randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import type { Request } from 'express';
import type PgBoss from 'pg-boss';
import type { AllowanceLimits } from '../../../shared/schemas/allowance.js';
import type { UserRef } from '../../../shared/schemas/recording.js';
import type { SweepLaunch } from '../../../shared/schemas/sweep.js';
import type { Project } from '../entities/project.js';
import { Sweep } from '../entities/sweep.js';
import { Team } from '../entities/team.js';
import { HttpError } from '../http/http-error.js';
import { sweepJobDefaults, sweepQueueNames } from '../queue/sweep-jobs.js';
import { sendInTransaction } from '../queue/transactional-send.js';
import { recordAudit } from '../services/audit-trail.js';
import { lockAllowance, teamUsage } from './allowance-ledger.js';
import { planLaunch } from './launch-plan.js';
import { estimateAnswer } from './sweep-estimate-answer.js';

/**
 * Launches a sweep (design step 1) in one transaction: the team's allowance row is locked, the three limits
 * are checked against the estimate (409 `allowance_exceeded` naming limit and estimate), the description is
 * frozen, the sweep stored queued and its prepare job enqueued; both commit together or not at all.
 */
export async function launchSweep(
  em: EntityManager,
  boss: PgBoss,
  project: Project,
  launch: SweepLaunch,
  launcher: UserRef & { email: string },
  defaults: AllowanceLimits,
  req: Request | null,
): Promise<string> {
  const plan = await planLaunch(em, project, launch);
  return em.fork().transactional(async (tx) => {
    const limits = await lockAllowance(tx, project.team.id, defaults);
    const team = await tx.findOneOrFail(Team, { id: project.team.id });
    const estimate = await estimateAnswer(tx, plan, team, limits, await teamUsage(tx, team.id));
    if (!estimate.fits) {
      const fields = Object.fromEntries(estimate.refusals.map((r) => [r.limit, r.message]));
      throw new HttpError(409, 'allowance_exceeded', estimate.refusals.map((r) => r.message).join(' '), fields);
    }
    const sweep = tx.create(Sweep, {
      id: randomUUID(),
      project: project.id,
      team,
      name: plan.name,
      state: 'queued',
      candidateSetId: plan.candidateSet.id,
      candidateSetName: plan.candidateSet.name,
      description: plan.description,
      launchedById: launcher.id,
      launchedByName: launcher.name,
      launchedByEmail: launcher.email,
      totalSubsets: plan.totalSubsets,
      estimatedCpuSeconds: plan.cpuSeconds,
      excluded: [],
      warnings: plan.warnings,
    });
    recordAudit(tx, req, {
      action: 'sweep.launched',
      teamId: team.id,
      targetType: 'sweep',
      targetId: sweep.id,
      details: { name: sweep.name, subsets: plan.totalSubsets, cpuSeconds: Math.round(plan.cpuSeconds) },
    });
    await tx.flush();
    await sendInTransaction(boss, tx, sweepQueueNames.prepare, { kind: 'prepare', sweepId: sweep.id }, sweepJobDefaults.prepare);
    return sweep.id;
  });
}
