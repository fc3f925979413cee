import type { ProjectSummary } from '../../../shared/schemas/project.js';
import type { Project } from '../entities/project.js';

/** The client's view of a project. */
export function toProjectSummary(project: Project): ProjectSummary {
  return {
    id: project.id,
    name: project.name,
    description: project.description,
    teamId: project.team.id,
    createdAt: project.createdAt.toISOString(),
    updatedAt: project.updatedAt.toISOString(),
  };
}
