import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { endedSweepStates } from '../../../../../shared/schemas/sweep';
import { Session } from '../../core/session';
import { CountPipe } from '../../shared/format/count-pipe';
import { DurationPipe } from '../../shared/format/duration-pipe';
import { FigurePipe } from '../../shared/format/figure-pipe';
import { SweepStateBadge } from '../../shared/sweep-state-badge';
import { ProjectContext } from './project-context';

/** How often the list refreshes while one of its sweeps is still queued or running. */
const refreshMs = 4000;

/** The project's sweeps, newest first, with state, progress and the best model found so far. */
@Component({
  selector: 'app-project-sweeps',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, MatTableModule, CountPipe, DurationPipe, FigurePipe, SweepStateBadge],
  template: `
    <div class="tab-bar">
      <p class="section-note">Each sweep tries every subset of candidate terms up to a size and ranks the fits.</p>
      @if (canEdit()) {
        <a mat-flat-button routerLink="new" [class.disabled]="!ready()" [attr.aria-disabled]="!ready()" data-test="new-sweep">
          <mat-icon>rocket_launch</mat-icon> New sweep
        </a>
      }
    </div>
    @if (canEdit() && !ready() && context.recordings() && context.candidateSets()) {
      <div class="callout" role="note">
        <mat-icon aria-hidden="true">info</mat-icon>
        <p>A sweep needs at least one recording and one candidate set. {{ missing() }}</p>
      </div>
    }
    @if (context.sweeps(); as sweeps) {
      @if (sweeps.length === 0) {
        <div class="empty-state" data-test="sweeps-empty">
          <mat-icon aria-hidden="true">manage_search</mat-icon>
          <h2>No sweeps yet</h2>
          <p>{{ canEdit() ? 'Launch a sweep to search the candidate terms for the energy of this mechanism.' : 'When an analyst of your team launches a sweep, you can follow it here.' }}</p>
        </div>
      } @else {
        <div class="panel table-panel">
          <table mat-table [dataSource]="sweeps" class="data-table" aria-label="Sweeps">
            <ng-container matColumnDef="name">
              <th mat-header-cell *matHeaderCellDef>Sweep</th>
              <td mat-cell *matCellDef="let s">
                <a class="row-title" [routerLink]="[s.id]">{{ s.name }}</a>
                <div class="muted small">{{ s.candidateSet.name }}</div>
              </td>
            </ng-container>
            <ng-container matColumnDef="state">
              <th mat-header-cell *matHeaderCellDef>State</th>
              <td mat-cell *matCellDef="let s"><app-sweep-state [state]="s.state" /></td>
            </ng-container>
            <ng-container matColumnDef="progress">
              <th mat-header-cell *matHeaderCellDef>Subsets tried</th>
              <td mat-cell *matCellDef="let s" class="progress-cell">
                <mat-progress-bar mode="determinate" [value]="percent(s.evaluated + s.rejected, s.totalSubsets)" [attr.aria-label]="'Progress of ' + s.name" />
                <span class="small muted">{{ s.evaluated + s.rejected | count: true }} of {{ s.totalSubsets | count: true }}</span>
              </td>
            </ng-container>
            <ng-container matColumnDef="best">
              <th mat-header-cell *matHeaderCellDef class="numeric">Best residual</th>
              <td mat-cell *matCellDef="let s" class="numeric">{{ s.best ? (s.best.rss | figure) : '–' }}</td>
            </ng-container>
            <ng-container matColumnDef="cpu">
              <th mat-header-cell *matHeaderCellDef class="numeric">CPU time</th>
              <td mat-cell *matCellDef="let s" class="numeric">{{ s.cpuSeconds | duration }}</td>
            </ng-container>
            <ng-container matColumnDef="launched">
              <th mat-header-cell *matHeaderCellDef>Launched</th>
              <td mat-cell *matCellDef="let s">
                {{ s.launchedAt | date: 'd MMM y, HH:mm' }}
                <div class="muted small">{{ s.launchedBy.name }}</div>
              </td>
            </ng-container>
            <tr mat-header-row *matHeaderRowDef="columns"></tr>
            <tr mat-row *matRowDef="let row; columns: columns"></tr>
          </table>
        </div>
      }
    } @else {
      <mat-progress-bar mode="indeterminate" aria-label="Loading sweeps" />
    }
  `,
  styles: `
    .disabled { pointer-events: none; opacity: 0.5; }
    .progress-cell { min-width: 160px; mat-progress-bar { margin: 4px 0 2px; } }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProjectSweeps {
  protected readonly context = inject(ProjectContext);
  protected readonly canEdit = inject(Session).canEdit;
  protected readonly columns = ['name', 'state', 'progress', 'best', 'cpu', 'launched'];
  protected readonly ready = computed(() => !!this.context.recordings()?.length && !!this.context.candidateSets()?.length);
  protected readonly missing = computed(() => {
    const gaps = [];
    if (!this.context.recordings()?.length) gaps.push('add a recording');
    if (!this.context.candidateSets()?.length) gaps.push('build a candidate set');
    return gaps.length ? `First ${gaps.join(' and ')} in the tabs above.` : '';
  });

  constructor() {
    const timer = setInterval(() => {
      if (this.context.sweeps()?.some((s) => !endedSweepStates.includes(s.state))) void this.context.reloadSweeps();
    }, refreshMs);
    inject(DestroyRef).onDestroy(() => clearInterval(timer));
  }

  protected percent(done: number, total: number): number {
    return total > 0 ? Math.min(100, (100 * done) / total) : 0;
  }
}
