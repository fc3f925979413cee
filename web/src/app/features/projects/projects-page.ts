import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import type { ProjectSummary } from '../../../../../shared/schemas/project';
import { toApiFailure } from '../../core/api-failure';
import { Session } from '../../core/session';
import { NewProjectDialog } from './new-project-dialog';
import { ProjectCard } from './project-card';
import { ProjectsApi } from './projects-api';

/** The signed-in user's projects, most recently changed first. */
@Component({
  selector: 'app-projects-page',
  imports: [RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, ProjectCard],
  templateUrl: './projects-page.html',
  styleUrl: './projects-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProjectsPage {
  private readonly projectsApi = inject(ProjectsApi);
  private readonly session = inject(Session);
  private readonly dialog = inject(MatDialog);
  private readonly router = inject(Router);
  protected readonly canEdit = this.session.canEdit;

  /** Admins see every team's projects (the server's team scope); everyone else sees their own team's. */
  protected readonly scope = computed(() => {
    const user = this.session.user();
    if (!user) return '';
    return user.role === 'admin'
      ? 'As an admin you see the projects of every team.'
      : `Shown here: everything your team, ${user.team.name}, can open.`;
  });
  protected readonly loading = signal(true);
  protected readonly failure = signal<string | null>(null);
  private readonly projects = signal<ProjectSummary[]>([]);
  protected readonly newestFirst = computed(() =>
    [...this.projects()].sort((a, b) => Date.parse(b.updatedAt) - Date.parse(a.updatedAt)),
  );

  constructor() {
    void this.load();
  }

  protected newProject(): void {
    this.dialog
      .open(NewProjectDialog, { autoFocus: 'first-tabbable' })
      .afterClosed()
      .subscribe((project: ProjectSummary | undefined) => {
        if (project) void this.router.navigate(['/projects', project.id]);
      });
  }

  protected async load(): Promise<void> {
    this.loading.set(true);
    this.failure.set(null);
    try {
      this.projects.set(await this.projectsApi.list());
    } catch (err) {
      this.failure.set(toApiFailure(err).message);
    } finally {
      this.loading.set(false);
    }
  }
}
