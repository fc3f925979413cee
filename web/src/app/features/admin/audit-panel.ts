import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { type AuditAction, type AuditEventView, auditActions } from '../../../../../shared/schemas/audit-event';
import { toApiFailure } from '../../core/api-failure';
import { LoadingState } from '../../shared/loading-state';
import { AdminApi } from './admin-api';

/** How actions read on screen; an action added later reads as its code until it gets a label here. */
const actionLabels: Partial<Record<AuditAction, string>> = {
  'session.signed_in': 'Signed in',
  'session.sign_in_failed': 'Sign-in failed',
  'session.signed_out': 'Signed out',
  'team.created': 'Team created',
  'team.renamed': 'Team renamed',
  'team.deleted': 'Team removed',
  'user.created': 'User added',
  'user.updated': 'User changed',
  'user.deleted': 'User removed',
  'project.created': 'Project created',
  'project.updated': 'Project changed',
  'project.deleted': 'Project deleted',
  'demo.seeded': 'Demo data added',
  'demo.work_seeded': 'Demo work added',
  'recording.uploaded': 'Recording added',
  'recording.deleted': 'Recording deleted',
  'candidate_set.created': 'Candidate set created',
  'candidate_set.updated': 'Candidate set changed',
  'candidate_set.deleted': 'Candidate set deleted',
  'sweep.launched': 'Sweep launched',
  'sweep.cancelled': 'Sweep cancelled',
  'allowance.updated': 'Allowance changed',
};

/** The newest audit events, filterable by kind, each with who, which team, what and the details. */
@Component({
  selector: 'app-audit-panel',
  imports: [LoadingState, DatePipe, MatButtonModule, MatFormFieldModule, MatIconModule, MatSelectModule, MatTableModule],
  template: `
    <div class="tab-bar">
      <mat-form-field class="filter">
        <mat-label>Show</mat-label>
        <mat-select [value]="filter()" (selectionChange)="filter.set($event.value)">
          <mat-option value="">Every kind of event</mat-option>
          @for (action of actions; track action) { <mat-option [value]="action">{{ label(action) }}</mat-option> }
        </mat-select>
      </mat-form-field>
      <button mat-stroked-button type="button" (click)="load()"><mat-icon>refresh</mat-icon> Refresh</button>
    </div>
    @if (events(); as list) {
      <div class="panel table-panel">
        <table mat-table [dataSource]="shown()" class="data-table" aria-label="Audit log" data-test="audit-log">
          <ng-container matColumnDef="when">
            <th mat-header-cell *matHeaderCellDef>When</th>
            <td mat-cell *matCellDef="let e" class="when">{{ e.createdAt | date: 'd MMM y, HH:mm:ss' }}</td>
          </ng-container>
          <ng-container matColumnDef="action">
            <th mat-header-cell *matHeaderCellDef>What</th>
            <td mat-cell *matCellDef="let e"><span class="action" [class.bad]="e.action === 'session.sign_in_failed'">{{ label(e.action) }}</span></td>
          </ng-container>
          <ng-container matColumnDef="actor">
            <th mat-header-cell *matHeaderCellDef>Who</th>
            <td mat-cell *matCellDef="let e">{{ e.actorEmail ?? '–' }}</td>
          </ng-container>
          <ng-container matColumnDef="team">
            <th mat-header-cell *matHeaderCellDef>Team</th>
            <td mat-cell *matCellDef="let e">{{ e.teamId ? (teamNames().get(e.teamId) ?? 'removed team') : '–' }}</td>
          </ng-container>
          <ng-container matColumnDef="details">
            <th mat-header-cell *matHeaderCellDef>Details</th>
            <td mat-cell *matCellDef="let e" class="details">{{ describe(e) }}</td>
          </ng-container>
          <tr mat-header-row *matHeaderRowDef="columns"></tr>
          <tr mat-row *matRowDef="let row; columns: columns"></tr>
          <tr class="mat-mdc-row" *matNoDataRow><td class="mat-mdc-cell muted" [attr.colspan]="columns.length">No events of this kind.</td></tr>
        </table>
      </div>
      <p class="muted small">The newest {{ list.length }} events.</p>
    } @else {
      <app-loading-state [failure]="failure()" label="Loading the audit log" />
    }
  `,
  styles: `
    .bar { display: flex; gap: 12px; align-items: flex-start; }
    .filter { width: 280px; }
    .bar button { margin-top: 8px; }
    .when { white-space: nowrap; }
    .action { font-weight: 500; }
    .action.bad { color: var(--mat-sys-error); }
    .details { font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface-variant); max-width: 420px; overflow-wrap: anywhere; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AuditPanel {
  private readonly adminApi = inject(AdminApi);
  protected readonly actions = auditActions;
  protected readonly columns = ['when', 'action', 'actor', 'team', 'details'];
  protected readonly teamNames = signal<ReadonlyMap<string, string>>(new Map());
  protected readonly events = signal<AuditEventView[] | null>(null);
  protected readonly failure = signal<string | null>(null);
  protected readonly filter = signal<AuditAction | ''>('');
  protected readonly shown = computed(() => {
    const filter = this.filter();
    return (this.events() ?? []).filter((e) => !filter || e.action === filter);
  });

  constructor() {
    void this.load();
  }

  protected async load(): Promise<void> {
    try {
      const [events, teams] = await Promise.all([this.adminApi.auditEvents(300), this.adminApi.teams()]);
      this.teamNames.set(new Map(teams.map((t) => [t.id, t.name])));
      this.events.set(events);
    } catch (err) {
      this.failure.set(toApiFailure(err).message);
    }
  }

  protected label(action: AuditAction): string {
    return actionLabels[action] ?? action.replace(/[._]/g, ' ');
  }

  protected describe(event: AuditEventView): string {
    const parts = Object.entries(event.details).map(([key, value]) => `${key}: ${typeof value === 'object' ? JSON.stringify(value) : String(value)}`);
    return parts.join(' · ') || (event.targetType ? `${event.targetType} ${event.targetId ?? ''}` : '');
  }
}
