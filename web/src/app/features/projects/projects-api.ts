import { Injectable, inject } from '@angular/core';
import {
  type ProjectInput,
  type ProjectSummary,
  projectListSchema,
  projectSummarySchema,
} from '../../../../../shared/schemas/project';
import { ApiClient } from '../../core/api-client';

/** The projects the signed-in user may see. */
@Injectable({ providedIn: 'root' })
export class ProjectsApi {
  private readonly api = inject(ApiClient);

  async list(): Promise<ProjectSummary[]> {
    const answer = await this.api.get('/projects', projectListSchema);
    return answer.projects;
  }

  get(projectId: string): Promise<ProjectSummary> {
    return this.api.get(`/projects/${projectId}`, projectSummarySchema);
  }

  create(input: ProjectInput): Promise<ProjectSummary> {
    return this.api.post('/projects', input, projectSummarySchema);
  }
}
