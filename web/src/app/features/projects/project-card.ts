import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import type { ProjectSummary } from '../../../../../shared/schemas/project';

/** One project in the list: its name, what it is about and when it last changed. */
@Component({
  selector: 'app-project-card',
  imports: [DatePipe, MatCardModule, MatIconModule],
  template: `
    <mat-card appearance="outlined" class="card">
      <div class="head">
        <span class="avatar" aria-hidden="true"><mat-icon>precision_manufacturing</mat-icon></span>
        <div class="heading">
          <h2 class="name">{{ project().name }}</h2>
          <p class="updated">
            Updated <time [attr.datetime]="project().updatedAt">{{ project().updatedAt | date: 'd MMM y, HH:mm' }}</time>
          </p>
        </div>
      </div>
      @if (project().description) {
        <p class="description">{{ project().description }}</p>
      } @else {
        <p class="description empty">No description yet.</p>
      }
    </mat-card>
  `,
  styles: `
    :host { display: block; height: 100%; }
    .card { height: 100%; box-sizing: border-box; padding: 16px 18px 18px; background: var(--mat-sys-surface); }
    .head { display: flex; gap: 14px; align-items: center; }
    .avatar {
      display: grid; place-items: center; flex: none; width: 40px; height: 40px; border-radius: 12px;
      background: var(--mat-sys-primary-container); color: var(--mat-sys-on-primary-container);
    }
    .heading { min-width: 0; }
    .name { margin: 0; font: var(--mat-sys-title-medium); overflow-wrap: anywhere; }
    .updated { margin: 2px 0 0; font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface-variant); }
    .description {
      margin: 14px 0 0;
      color: var(--mat-sys-on-surface-variant);
      display: -webkit-box; -webkit-box-orient: vertical; -webkit-line-clamp: 3; overflow: hidden;
    }
    .empty { font-style: italic; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProjectCard {
  readonly project = input.required<ProjectSummary>();
}
