import { LockMode, type MikroORM } from '@mikro-orm/postgresql';
import { Router, type Request } from 'express';
import type { AllowanceLimits } from '../../../shared/schemas/allowance.js';
import { endedSweepStates, sweepLaunchSchema, sweepListQuerySchema, type SweepList } from '../../../shared/schemas/sweep.js';
import { loadVisibleProject } from '../auth/project-access.js';
import { editorRoles, requireRole, requireUser } from '../auth/require-role.js';
import { teamScope } from '../auth/team-scope.js';
import { Sweep } from '../entities/sweep.js';
import { Team } from '../entities/team.js';
import { HttpError, notFound } from '../http/http-error.js';
import { parseBody, parseInput } from '../http/parse-body.js';
import { parseId } from '../http/parse-id.js';
import type { QueueClient } from '../queue/queue-client.js';
import { recordAudit } from '../services/audit-trail.js';
import { readAllowance, teamUsage } from '../sweeps/allowance-ledger.js';
import { planLaunch } from '../sweeps/launch-plan.js';
import { launchSweep } from '../sweeps/sweep-launch.js';
import { estimateAnswer } from '../sweeps/sweep-estimate-answer.js';
import { endSweep } from '../sweeps/sweep-end.js';
import { loadSweepForView, toSweepDetail, toSweepLeaderboard, toSweepSummary } from '../sweeps/sweep-views.js';

export interface SweepRoutesOptions {
  allowanceDefaults: AllowanceLimits;
}

/** /api/projects/:projectId/sweeps: estimate, launch and list. */
export function projectSweepsRouter(orm: MikroORM, queue: QueueClient, options: SweepRoutesOptions): Router {
  const router = Router({ mergeParams: true });

  router.get('/', requireUser, async (req, res) => {
    const project = await loadVisibleProject(orm.em, req);
    const { state } = parseInput(sweepListQuerySchema, req.query);
    const sweeps = await orm.em.find(Sweep, { project, ...(state ? { state } : {}) }, { orderBy: { launchedAt: 'desc' }, populate: ['result'] });
    const body: SweepList = { sweeps: sweeps.map(toSweepSummary) };
    res.json(body);
  });

  router.post('/estimate', requireUser, async (req, res) => {
    const project = await loadVisibleProject(orm.em, req);
    const plan = await planLaunch(orm.em, project, parseBody(sweepLaunchSchema, req));
    const team = await orm.em.findOneOrFail(Team, { id: project.team.id });
    const limits = await readAllowance(orm.em, team.id, options.allowanceDefaults);
    res.json(await estimateAnswer(orm.em, plan, team, limits, await teamUsage(orm.em, team.id)));
  });

  router.post('/', requireRole(...editorRoles), async (req, res) => {
    const project = await loadVisibleProject(orm.em, req);
    const launch = parseBody(sweepLaunchSchema, req);
    const user = req.user!;
    const launcher = { id: user.id, name: user.name, email: user.email };
    const sweepId = await launchSweep(orm.em, await queue.get(), project, launch, launcher, options.allowanceDefaults, req);
    const sweep = await loadSweepForView(orm.em, { id: sweepId });
    res.status(201).json(await toSweepDetail(orm.em, sweep!));
  });

  return router;
}

/** /api/sweeps/:id: read one, cancel it, read its leaderboard. */
export function sweepsRouter(orm: MikroORM, queue: QueueClient): Router {
  const router = Router();

  async function loadVisibleSweep(req: Request): Promise<Sweep> {
    const id = parseId(req.params.id, 'That sweep');
    const sweep = await loadSweepForView(orm.em, { id, ...teamScope(req.user!) });
    if (!sweep) throw notFound('That sweep');
    return sweep;
  }

  router.get('/:id', requireUser, async (req, res) => {
    res.json(await toSweepDetail(orm.em, await loadVisibleSweep(req)));
  });

  router.get('/:id/leaderboard', requireUser, async (req, res) => {
    res.json(toSweepLeaderboard(await loadVisibleSweep(req)));
  });

  router.post('/:id/cancel', requireRole(...editorRoles), async (req, res) => {
    const visible = await loadVisibleSweep(req);
    const boss = await queue.get();
    const user = req.user!;
    await orm.em.fork().transactional(async (tx) => {
      const sweep = await tx.findOneOrFail(Sweep, { id: visible.id }, { lockMode: LockMode.PESSIMISTIC_WRITE });
      if (endedSweepStates.includes(sweep.state)) {
        throw new HttpError(409, 'conflict', `The sweep has already ended (${sweep.state}); there is nothing to cancel.`);
      }
      await endSweep(tx, boss, sweep, { state: 'cancelled', cancelledBy: { id: user.id, name: user.name } });
      recordAudit(tx, req, { action: 'sweep.cancelled', teamId: sweep.team.id, targetType: 'sweep', targetId: sweep.id, details: { name: sweep.name } });
    });
    res.json(await toSweepDetail(orm.em, (await loadSweepForView(orm.em, { id: visible.id }))!));
  });

  return router;
}
