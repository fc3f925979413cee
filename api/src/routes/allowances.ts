import type { MikroORM } from '@mikro-orm/postgresql';
import { Router } from 'express';
import * as z from 'zod';
import { allowanceUpdateSchema, type AllowanceLimits, type AllowanceList } from '../../../shared/schemas/allowance.js';
import { requireUser } from '../auth/require-role.js';
import { Team } from '../entities/team.js';
import { TeamAllowance } from '../entities/team-allowance.js';
import { notFound } from '../http/http-error.js';
import { parseBody, parseInput } from '../http/parse-body.js';
import { parseId } from '../http/parse-id.js';
import { recordAudit } from '../services/audit-trail.js';
import { allowanceStatus, ensureAllowance, monthLabel, readAllowance, teamUsage } from '../sweeps/allowance-ledger.js';

async function statusOf(orm: MikroORM, team: Team, defaults: AllowanceLimits) {
  const limits = await readAllowance(orm.em, team.id, defaults);
  return allowanceStatus(team, limits, await teamUsage(orm.em, team.id));
}

/** /api/allowance: the signed-in user's team's allowance and use (admins may ask for any team). */
export function ownAllowanceRouter(orm: MikroORM, defaults: AllowanceLimits): Router {
  const router = Router();
  router.get('/', requireUser, async (req, res) => {
    const { teamId } = parseInput(z.object({ teamId: z.uuid().optional() }), req.query);
    const user = req.user!;
    const wanted = user.role === 'admin' && teamId ? teamId : user.teamId;
    const team = await orm.em.findOne(Team, { id: wanted });
    if (!team) throw notFound('That team');
    res.json(await statusOf(orm, team, defaults));
  });
  return router;
}

/** /api/admin/allowances: every team's allowance and use; admins change the limits. */
export function adminAllowancesRouter(orm: MikroORM, defaults: AllowanceLimits): Router {
  const router = Router();

  router.get('/', async (_req, res) => {
    const teams = await orm.em.find(Team, {}, { orderBy: { name: 'asc' } });
    const body: AllowanceList = { month: monthLabel(new Date()), allowances: [] };
    for (const team of teams) body.allowances.push(await statusOf(orm, team, defaults));
    res.json(body);
  });

  router.patch('/:teamId', async (req, res) => {
    const team = await orm.em.findOne(Team, { id: parseId(req.params.teamId, 'That team') });
    if (!team) throw notFound('That team');
    const update = parseBody(allowanceUpdateSchema, req);
    await ensureAllowance(orm.em, team.id, defaults);
    const allowance = await orm.em.findOneOrFail(TeamAllowance, { team: team.id });
    orm.em.assign(allowance, update);
    recordAudit(orm.em, req, { action: 'allowance.updated', teamId: team.id, targetType: 'team', targetId: team.id, details: { ...update } });
    await orm.em.flush();
    res.json(await statusOf(orm, team, defaults));
  });

  return router;
}
