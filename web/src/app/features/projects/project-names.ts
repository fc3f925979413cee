import { Injectable, inject, signal } from '@angular/core';
import { ProjectsApi } from './projects-api';

/** Names of projects for breadcrumbs, fetched once per project and kept for the session. */
@Injectable({ providedIn: 'root' })
export class ProjectNames {
  private readonly projectsApi = inject(ProjectsApi);
  private readonly names = signal<Readonly<Record<string, string>>>({});
  private readonly asked = new Set<string>();

  /** The project's name once known, "Project" until then. */
  label(projectId: string): string {
    return this.names()[projectId] ?? 'Project';
  }

  /** Fetches the name unless it is known or on its way. */
  ensure(projectId: string): void {
    if (this.asked.has(projectId)) return;
    this.asked.add(projectId);
    this.projectsApi.get(projectId).then(
      (project) => this.remember(projectId, project.name),
      () => this.asked.delete(projectId),
    );
  }

  remember(projectId: string, name: string): void {
    this.names.update((names) => ({ ...names, [projectId]: name }));
  }
}
