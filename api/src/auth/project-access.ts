import type { EntityManager } from '@mikro-orm/postgresql';
import type { Request } from 'express';
import { Project } from '../entities/project.js';
import { forbidden, notFound } from '../http/http-error.js';
import { parseId } from '../http/parse-id.js';
import { editorRoles } from './require-role.js';
import type { AuthUser } from './session-user.js';
import { teamScope } from './team-scope.js';

/** The project named by `:projectId` if the user may see it; another team's project is "not found". */
export async function loadVisibleProject(em: EntityManager, req: Request, param = 'projectId'): Promise<Project> {
  const id = parseId(req.params[param], 'That project');
  const project = await em.findOne(Project, { id, ...teamScope(req.user!) });
  if (!project) throw notFound('That project');
  return project;
}

/** Whether the user may see work of the given team. */
export function maySee(user: AuthUser, teamId: string): boolean {
  return user.role === 'admin' || user.teamId === teamId;
}

/** Refuses users who may read but not change (viewers) with 403, after the team check has passed. */
export function requireEditor(user: AuthUser): void {
  if (!editorRoles.includes(user.role)) throw forbidden();
}
