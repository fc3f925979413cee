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
      <mat-card-header>
        <mat-icon mat-card-avatar class="avatar" aria-hidden="true">precision_manufacturing</mat-icon>
        <mat-card-title><h2 class="name">{{ project().name }}</h2></mat-card-title>
        <mat-card-subtitle>
          Updated <time [attr.datetime]="project().updatedAt">{{ project().updatedAt | date: 'd MMM y, HH:mm' }}</time>
        </mat-card-subtitle>
      </mat-card-header>
      <mat-card-content>
        @if (project().description) {
          <p class="description">{{ project().description }}</p>
        } @else {
          <p class="description empty">No description yet.</p>
        }
      </mat-card-content>
    </mat-card>
  `,
  styles: `
    :host { display: block; }
    .card { height: 100%; box-sizing: border-box; background: var(--mat-sys-surface); }
    .avatar {
      display: grid; place-items: center;
      background: var(--mat-sys-primary-container); color: var(--mat-sys-on-primary-container);
    }
    .name { margin: 0; font: var(--mat-sys-title-medium); overflow-wrap: anywhere; }
    .description {
      margin: 12px 0 0;
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
