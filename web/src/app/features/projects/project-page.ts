import { ChangeDetectionStrategy, Component, computed, effect, inject, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTabsModule } from '@angular/material/tabs';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { Session } from '../../core/session';
import { Breadcrumbs } from '../../shared/breadcrumbs';
import { ProjectContext } from './project-context';
import { ProjectNextStep } from './project-next-step';

/**
 * One project: its name and description, and tabs for the three steps of the job (recordings, candidate
 * sets, sweeps), each tab showing how many it holds.
 */
@Component({
  selector: 'app-project-page',
  imports: [RouterOutlet, RouterLink, RouterLinkActive, MatIconModule, MatProgressBarModule, MatTabsModule, Breadcrumbs, ProjectNextStep],
  providers: [ProjectContext],
  template: `
    @if (context.failure(); as message) {
      <app-breadcrumbs [trail]="[{ label: 'Projects', link: ['/projects'] }, { label: 'Project' }]" />
      <div class="callout error" role="alert"><mat-icon aria-hidden="true">error</mat-icon><p>{{ message }}</p></div>
    }
    @if (context.project(); as project) {
      <app-breadcrumbs [trail]="[{ label: 'Projects', link: ['/projects'] }, { label: project.name }]" />
      <header class="page-header">
        <div>
          <h1 class="page-title">{{ project.name }}</h1>
          <p class="page-subtitle">{{ project.description || 'No description yet.' }}</p>
        </div>
        @if (!canEdit()) {
          <span class="read-only"><mat-icon aria-hidden="true">visibility</mat-icon> Read-only: you can look at everything here</span>
        }
      </header>

      <app-project-next-step />
      <nav mat-tab-nav-bar [tabPanel]="panel" aria-label="Project sections" class="tabs">
        @for (tab of tabs(); track tab.path) {
          <a mat-tab-link [routerLink]="tab.path" routerLinkActive #active="routerLinkActive" [active]="active.isActive">
            <span class="step" aria-hidden="true">{{ tab.step }}</span>
            {{ tab.label }}
            @if (tab.count !== null) {
              <span class="count">{{ tab.count }}</span>
            }
          </a>
        }
      </nav>
      <mat-tab-nav-panel #panel>
        <div class="tab-body"><router-outlet /></div>
      </mat-tab-nav-panel>
    } @else if (!context.failure()) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading the project" />
    }
  `,
  styles: `
    :host { display: block; }
    .read-only {
      display: inline-flex; align-items: center; gap: 6px; padding: 6px 12px; border-radius: 999px;
      background: var(--mat-sys-surface-container-high); color: var(--mat-sys-on-surface-variant); font: var(--mat-sys-label-large);
      mat-icon { width: 18px; height: 18px; font-size: 18px; }
    }
    .tabs { border-bottom: 1px solid var(--mat-sys-outline-variant); }
    .step {
      display: inline-grid; place-items: center; width: 22px; height: 22px; margin-right: 8px; border-radius: 50%;
      background: var(--mat-sys-surface-container-highest); color: var(--mat-sys-on-surface-variant); font: var(--mat-sys-label-medium);
    }
    .mdc-tab--active .step { background: var(--mat-sys-primary); color: var(--mat-sys-on-primary); }
    .count {
      margin-left: 8px; padding: 0 8px; border-radius: 999px; background: var(--mat-sys-surface-container-high);
      color: var(--mat-sys-on-surface-variant); font: var(--mat-sys-label-medium); line-height: 20px;
    }
    .tab-body { padding-top: 24px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProjectPage {
  protected readonly context = inject(ProjectContext);
  protected readonly canEdit = inject(Session).canEdit;
  readonly projectId = input.required<string>();

  protected readonly tabs = computed(() => [
    { path: 'recordings', step: 1, label: 'Recordings', count: this.context.recordings()?.length ?? null },
    { path: 'candidate-sets', step: 2, label: 'Candidate sets', count: this.context.candidateSets()?.length ?? null },
    { path: 'sweeps', step: 3, label: 'Sweeps', count: this.context.sweeps()?.length ?? null },
  ]);

  constructor() {
    effect(() => void this.context.open(this.projectId()));
  }
}
