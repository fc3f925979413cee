import { Injectable, inject } from '@angular/core';
import { type ProjectSummary, projectListSchema } from '../../../../../shared/schemas/project';
import { ApiClient } from '../../core/api-client';

/** The projects the signed-in user may see. */
@Injectable({ providedIn: 'root' })
export class ProjectsApi {
  private readonly api = inject(ApiClient);

  async list(): Promise<ProjectSummary[]> {
    const answer = await this.api.get('/projects', projectListSchema);
    return answer.projects;
  }
}
