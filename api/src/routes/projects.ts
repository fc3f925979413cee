import { randomUUID } from 'node:crypto';
import type { MikroORM } from '@mikro-orm/postgresql';
import { Router, type Request } from 'express';
import { projectInputSchema, type ProjectList } from '../../../shared/schemas/project.js';
import { projectCreateSchema } from '../../../shared/schemas/project-create.js';
import { editorRoles, requireRole, requireUser } from '../auth/require-role.js';
import { teamScope } from '../auth/team-scope.js';
import { Project } from '../entities/project.js';
import { Sweep } from '../entities/sweep.js';
import { Team } from '../entities/team.js';
import { HttpError, notFound } from '../http/http-error.js';
import { parseBody } from '../http/parse-body.js';
import { parseId } from '../http/parse-id.js';
import { withUniqueConflict } from '../http/unique-conflict.js';
import { recordAudit } from '../services/audit-trail.js';
import { toProjectSummary } from '../services/project-view.js';

const duplicateName = 'This team already has a project with that name.';

/** /api/projects: a team's projects. Everyone in the team reads; analysts and admins change. */
export function projectsRouter(orm: MikroORM): Router {
  const router = Router();

  /** The project named in the path if the user may see it; another team's project is "not found". */
  async function loadVisibleProject(req: Request): Promise<Project> {
    const id = parseId(req.params.id, 'That project');
    const project = await orm.em.findOne(Project, { id, ...teamScope(req.user!) });
    if (!project) throw notFound('That project');
    return project;
  }

  /** The team a new project goes to: the analyst's own; for admins the one named, else their own. */
  async function targetTeam(req: Request, teamId: string | undefined): Promise<Team> {
    const user = req.user!;
    const wanted = teamId ?? user.teamId;
    if (user.role !== 'admin' && wanted !== user.teamId) throw notFound('That team');
    const team = await orm.em.findOne(Team, { id: wanted });
    if (!team) throw notFound('That team');
    return team;
  }

  router.get('/', requireUser, async (req, res) => {
    const projects = await orm.em.find(Project, teamScope(req.user!), { orderBy: { name: 'asc' } });
    const body: ProjectList = { projects: projects.map(toProjectSummary) };
    res.json(body);
  });

  router.post('/', requireRole(...editorRoles), async (req, res) => {
    const input = parseBody(projectCreateSchema, req);
    const team = await targetTeam(req, input.teamId);
    const project = orm.em.create(Project, { id: randomUUID(), team, name: input.name, description: input.description });
    recordAudit(orm.em, req, { action: 'project.created', teamId: team.id, targetType: 'project', targetId: project.id, details: { name: project.name } });
    await withUniqueConflict(() => orm.em.flush(), 'name', duplicateName);
    res.status(201).json(toProjectSummary(project));
  });

  router.get('/:id', requireUser, async (req, res) => {
    res.json(toProjectSummary(await loadVisibleProject(req)));
  });

  router.patch('/:id', requireRole(...editorRoles), async (req, res) => {
    const project = await loadVisibleProject(req);
    const input = parseBody(projectInputSchema, req);
    orm.em.assign(project, { name: input.name, description: input.description });
    recordAudit(orm.em, req, { action: 'project.updated', teamId: project.team.id, targetType: 'project', targetId: project.id, details: { name: input.name } });
    await withUniqueConflict(() => orm.em.flush(), 'name', duplicateName);
    res.json(toProjectSummary(project));
  });

  router.delete('/:id', requireRole(...editorRoles), async (req, res) => {
    const project = await loadVisibleProject(req);
    const active = await orm.em.count(Sweep, { project, state: ['queued', 'running'] });
    if (active > 0) throw new HttpError(409, 'conflict', `${active} sweep(s) of this project are queued or running; cancel them first.`);
    recordAudit(orm.em, req, { action: 'project.deleted', teamId: project.team.id, targetType: 'project', targetId: project.id, details: { name: project.name } });
    orm.em.remove(project);
    await orm.em.flush();
    res.status(204).end();
  });

  return router;
}
