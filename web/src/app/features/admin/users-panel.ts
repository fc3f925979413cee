import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { type Role, roles } from '../../../../../shared/schemas/session';
import type { AdminTeam } from '../../../../../shared/schemas/team-admin';
import type { AdminUser, UserUpdate } from '../../../../../shared/schemas/user-admin';
import { toApiFailure } from '../../core/api-failure';
import { FailureNotice } from '../../core/failure-notice';
import { Session } from '../../core/session';
import { Confirmation } from '../../shared/confirmation';
import { roleLabel } from '../../shell/role-label';
import { LoadingState } from '../../shared/loading-state';
import { AdminApi } from './admin-api';
import { NewUserDialog } from './new-user-dialog';

/** Every account: its team and role, changed in place; accounts added and removed. */
@Component({
  selector: 'app-users-panel',
  imports: [LoadingState, DatePipe, MatButtonModule, MatIconModule, MatSelectModule, MatTableModule, MatTooltipModule],
  template: `
    <div class="tab-bar">
      <p class="section-note">Admins manage everything; analysts create and change their team's work; viewers read it.</p>
      <button mat-flat-button type="button" (click)="add()" [disabled]="!teams().length"><mat-icon>person_add</mat-icon> Add user</button>
    </div>
    @if (users(); as list) {
      <div class="panel table-panel">
        <table mat-table [dataSource]="list" class="data-table" aria-label="Users">
          <ng-container matColumnDef="name">
            <th mat-header-cell *matHeaderCellDef>Name</th>
            <td mat-cell *matCellDef="let u">{{ u.name }}<div class="muted small">{{ u.email }}</div></td>
          </ng-container>
          <ng-container matColumnDef="team">
            <th mat-header-cell *matHeaderCellDef>Team</th>
            <td mat-cell *matCellDef="let u">
              <mat-select class="inline" [value]="u.team.id" (selectionChange)="update(u, { teamId: $event.value })" [disabled]="u.id === me()" [attr.aria-label]="'Team of ' + u.name">
                @for (t of teams(); track t.id) { <mat-option [value]="t.id">{{ t.name }}</mat-option> }
              </mat-select>
            </td>
          </ng-container>
          <ng-container matColumnDef="role">
            <th mat-header-cell *matHeaderCellDef>Role</th>
            <td mat-cell *matCellDef="let u">
              <mat-select class="inline" [value]="u.role" (selectionChange)="update(u, { role: $event.value })" [disabled]="u.id === me()" [attr.aria-label]="'Role of ' + u.name">
                @for (r of roles; track r) { <mat-option [value]="r">{{ label(r) }}</mat-option> }
              </mat-select>
            </td>
          </ng-container>
          <ng-container matColumnDef="created">
            <th mat-header-cell *matHeaderCellDef>Since</th>
            <td mat-cell *matCellDef="let u">{{ u.createdAt | date: 'd MMM y' }}</td>
          </ng-container>
          <ng-container matColumnDef="actions">
            <th mat-header-cell *matHeaderCellDef><span class="visually-hidden">Actions</span></th>
            <td mat-cell *matCellDef="let u" class="actions">
              @if (u.id !== me()) {
                <button mat-icon-button type="button" (click)="remove(u)" [attr.aria-label]="'Remove ' + u.name" matTooltip="Remove this account"><mat-icon>person_remove</mat-icon></button>
              } @else {
                <span class="muted small">you</span>
              }
            </td>
          </ng-container>
          <tr mat-header-row *matHeaderRowDef="columns"></tr>
          <tr mat-row *matRowDef="let row; columns: columns"></tr>
        </table>
      </div>
    } @else {
      <app-loading-state [failure]="failure()" label="Loading users" />
    }
  `,
  styles: `
    .inline { width: 220px; font: var(--mat-sys-body-medium); }
    .actions { width: 64px; text-align: right; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UsersPanel {
  private readonly adminApi = inject(AdminApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly confirmation = inject(Confirmation);
  private readonly failureNotice = inject(FailureNotice);
  private readonly session = inject(Session);
  protected readonly me = computed(() => this.session.user()?.id ?? '');
  protected readonly roles = roles;
  protected readonly columns = ['name', 'team', 'role', 'created', 'actions'];
  protected readonly users = signal<AdminUser[] | null>(null);
  protected readonly teams = signal<AdminTeam[]>([]);
  protected readonly failure = signal<string | null>(null);

  constructor() {
    void this.load();
  }

  private async load(): Promise<void> {
    try {
      const [users, teams] = await Promise.all([this.adminApi.users(), this.adminApi.teams()]);
      this.teams.set(teams);
      this.users.set(users.sort((a, b) => a.team.name.localeCompare(b.team.name) || a.name.localeCompare(b.name)));
    } catch (err) {
      this.failure.set(toApiFailure(err).message);
    }
  }

  protected label(role: Role): string {
    return roleLabel(role);
  }

  protected async update(user: AdminUser, change: UserUpdate): Promise<void> {
    try {
      const updated = await this.adminApi.updateUser(user.id, change);
      this.users.update((list) => list?.map((u) => (u.id === updated.id ? updated : u)) ?? null);
      this.snackBar.open(`${updated.name}: ${roleLabel(updated.role)} in ${updated.team.name}.`, 'Close', { duration: 4000 });
    } catch (err) {
      this.failureNotice.show(err);
      this.users.update((list) => list?.map((u) => ({ ...u })) ?? null);
    }
  }

  protected add(): void {
    this.dialog
      .open(NewUserDialog, { data: this.teams() })
      .afterClosed()
      .subscribe((user: AdminUser | undefined) => {
        if (user) {
          this.users.update((list) => [...(list ?? []), user]);
          this.snackBar.open(`${user.name} can now sign in as ${roleLabel(user.role).toLowerCase()}.`, 'Close', { duration: 4000 });
        }
      });
  }

  protected async remove(user: AdminUser): Promise<void> {
    const yes = await this.confirmation.ask({
      title: `Remove ${user.name}?`,
      message: `${user.email} can no longer sign in. The work of ${user.team.name} stays.`,
      confirm: 'Remove account',
      keep: 'Keep it',
      destructive: true,
    });
    if (!yes) return;
    try {
      await this.adminApi.deleteUser(user.id);
      this.users.update((list) => list?.filter((u) => u.id !== user.id) ?? null);
    } catch (err) {
      this.failureNotice.show(err);
    }
  }
}
