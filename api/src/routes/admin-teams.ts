import { randomUUID } from 'node:crypto';
import type { MikroORM } from '@mikro-orm/postgresql';
import { Router } from 'express';
import { teamInputSchema, type AdminTeamList } from '../../../shared/schemas/team-admin.js';
import { Project } from '../entities/project.js';
import { Team } from '../entities/team.js';
import { User } from '../entities/user.js';
import { HttpError, notFound } from '../http/http-error.js';
import { parseBody } from '../http/parse-body.js';
import { parseId } from '../http/parse-id.js';
import { withUniqueConflict } from '../http/unique-conflict.js';
import { toAdminTeam } from '../services/admin-views.js';
import { recordAudit } from '../services/audit-trail.js';

const duplicateName = 'A team with that name exists.';

/** /api/admin/teams: admins list, create, rename and delete (empty) teams. */
export function adminTeamsRouter(orm: MikroORM): Router {
  const router = Router();

  async function countsOf(teamId: string): Promise<{ users: number; projects: number }> {
    const [users, projects] = await Promise.all([orm.em.count(User, { team: teamId }), orm.em.count(Project, { team: teamId })]);
    return { users, projects };
  }

  async function loadTeam(rawId: string): Promise<Team> {
    const team = await orm.em.findOne(Team, { id: parseId(rawId, 'That team') });
    if (!team) throw notFound('That team');
    return team;
  }

  router.get('/', async (_req, res) => {
    const teams = await orm.em.find(Team, {}, { orderBy: { name: 'asc' } });
    const body: AdminTeamList = { teams: await Promise.all(teams.map(async (team) => toAdminTeam(team, await countsOf(team.id)))) };
    res.json(body);
  });

  router.post('/', async (req, res) => {
    const { name } = parseBody(teamInputSchema, req);
    const team = orm.em.create(Team, { id: randomUUID(), name });
    recordAudit(orm.em, req, { action: 'team.created', teamId: team.id, targetType: 'team', targetId: team.id, details: { name } });
    await withUniqueConflict(() => orm.em.flush(), 'name', duplicateName);
    res.status(201).json(toAdminTeam(team, { users: 0, projects: 0 }));
  });

  router.patch('/:id', async (req, res) => {
    const team = await loadTeam(req.params.id);
    const { name } = parseBody(teamInputSchema, req);
    recordAudit(orm.em, req, { action: 'team.renamed', teamId: team.id, targetType: 'team', targetId: team.id, details: { from: team.name, to: name } });
    team.name = name;
    await withUniqueConflict(() => orm.em.flush(), 'name', duplicateName);
    res.json(toAdminTeam(team, await countsOf(team.id)));
  });

  router.delete('/:id', async (req, res) => {
    const team = await loadTeam(req.params.id);
    const counts = await countsOf(team.id);
    if (counts.users || counts.projects) {
      throw new HttpError(409, 'conflict', `The team still has ${counts.users} user(s) and ${counts.projects} project(s); move or delete them first.`);
    }
    recordAudit(orm.em, req, { action: 'team.deleted', teamId: team.id, targetType: 'team', targetId: team.id, details: { name: team.name } });
    orm.em.remove(team);
    await orm.em.flush();
    res.status(204).end();
  });

  return router;
}
