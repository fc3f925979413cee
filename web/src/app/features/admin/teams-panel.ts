import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { type AdminTeam, teamInputSchema } from '../../../../../shared/schemas/team-admin';
import { toApiFailure } from '../../core/api-failure';
import { FailureNotice } from '../../core/failure-notice';
import { fieldMessage } from '../../core/schema-issues';
import { zodValidator } from '../../core/zod-validator';
import { Confirmation } from '../../shared/confirmation';
import { LoadingState } from '../../shared/loading-state';
import { AdminApi } from './admin-api';

/** Teams: how many people and projects each has; new teams, renames, and removal of empty teams. */
@Component({
  selector: 'app-teams-panel',
  imports: [LoadingState, DatePipe, ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatTableModule, MatTooltipModule],
  template: `
    <form class="panel add" (ngSubmit)="create()" novalidate>
      <mat-form-field>
        <mat-label>New team name</mat-label>
        <input matInput [formControl]="newName" />
        <mat-error>{{ message(newName) }}</mat-error>
      </mat-form-field>
      <button mat-flat-button type="submit"><mat-icon>group_add</mat-icon> Add team</button>
    </form>
    @if (teams(); as list) {
      <div class="panel table-panel">
        <table mat-table [dataSource]="list" class="data-table" aria-label="Teams">
          <ng-container matColumnDef="name">
            <th mat-header-cell *matHeaderCellDef>Team</th>
            <td mat-cell *matCellDef="let t">
              @if (editing() === t.id) {
                <form class="rename" (ngSubmit)="rename(t)" novalidate>
                  <mat-form-field subscriptSizing="dynamic">
                    <mat-label>Name</mat-label>
                    <input matInput [formControl]="editName" />
                    <mat-error>{{ message(editName) }}</mat-error>
                  </mat-form-field>
                  <button mat-button type="submit">Save</button>
                  <button mat-button type="button" (click)="editing.set(null)">Back</button>
                </form>
              } @else {
                {{ t.name }}
              }
            </td>
          </ng-container>
          <ng-container matColumnDef="users">
            <th mat-header-cell *matHeaderCellDef class="numeric">People</th>
            <td mat-cell *matCellDef="let t" class="numeric">{{ t.userCount }}</td>
          </ng-container>
          <ng-container matColumnDef="projects">
            <th mat-header-cell *matHeaderCellDef class="numeric">Projects</th>
            <td mat-cell *matCellDef="let t" class="numeric">{{ t.projectCount }}</td>
          </ng-container>
          <ng-container matColumnDef="created">
            <th mat-header-cell *matHeaderCellDef>Since</th>
            <td mat-cell *matCellDef="let t">{{ t.createdAt | date: 'd MMM y' }}</td>
          </ng-container>
          <ng-container matColumnDef="actions">
            <th mat-header-cell *matHeaderCellDef><span class="visually-hidden">Actions</span></th>
            <td mat-cell *matCellDef="let t" class="actions">
              <button mat-icon-button type="button" (click)="startRename(t)" [attr.aria-label]="'Rename ' + t.name" matTooltip="Rename"><mat-icon>edit</mat-icon></button>
              <button mat-icon-button type="button" (click)="remove(t)" [disabled]="t.userCount > 0 || t.projectCount > 0" [attr.aria-label]="'Remove ' + t.name" matTooltip="Remove (only an empty team)"><mat-icon>delete</mat-icon></button>
            </td>
          </ng-container>
          <tr mat-header-row *matHeaderRowDef="columns"></tr>
          <tr mat-row *matRowDef="let row; columns: columns"></tr>
        </table>
      </div>
    } @else {
      <app-loading-state [failure]="failure()" label="Loading teams" />
    }
  `,
  styles: `
    .add { display: flex; gap: 12px; align-items: flex-start; margin-bottom: 16px; }
    .add mat-form-field { flex: 0 1 360px; }
    .add button { margin-top: 8px; }
    .rename { display: flex; align-items: center; gap: 4px; padding: 6px 0; }
    .actions { width: 110px; text-align: right; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TeamsPanel {
  private readonly adminApi = inject(AdminApi);
  private readonly confirmation = inject(Confirmation);
  private readonly failureNotice = inject(FailureNotice);
  private readonly fb = inject(FormBuilder).nonNullable;
  protected readonly columns = ['name', 'users', 'projects', 'created', 'actions'];
  protected readonly teams = signal<AdminTeam[] | null>(null);
  protected readonly failure = signal<string | null>(null);
  protected readonly editing = signal<string | null>(null);
  protected readonly newName = this.fb.control('', zodValidator(teamInputSchema.shape.name));
  protected readonly editName = this.fb.control('', zodValidator(teamInputSchema.shape.name));

  constructor() {
    void this.load();
  }

  private async load(): Promise<void> {
    try {
      this.teams.set(await this.adminApi.teams());
    } catch (err) {
      this.failure.set(toApiFailure(err).message);
    }
  }

  protected message(control: Parameters<typeof fieldMessage>[0]): string {
    return fieldMessage(control);
  }

  protected async create(): Promise<void> {
    this.newName.markAsTouched();
    if (this.newName.invalid) return;
    try {
      const team = await this.adminApi.createTeam({ name: this.newName.value });
      this.teams.update((list) => [...(list ?? []), team]);
      this.newName.reset('');
    } catch (err) {
      const failure = toApiFailure(err);
      this.newName.setErrors({ server: failure.fields['name'] ?? failure.message });
    }
  }

  protected startRename(team: AdminTeam): void {
    this.editName.reset(team.name);
    this.editing.set(team.id);
  }

  protected async rename(team: AdminTeam): Promise<void> {
    this.editName.markAsTouched();
    if (this.editName.invalid) return;
    try {
      const renamed = await this.adminApi.renameTeam(team.id, { name: this.editName.value });
      this.teams.update((list) => list?.map((t) => (t.id === renamed.id ? renamed : t)) ?? null);
      this.editing.set(null);
    } catch (err) {
      const failure = toApiFailure(err);
      this.editName.setErrors({ server: failure.fields['name'] ?? failure.message });
    }
  }

  protected async remove(team: AdminTeam): Promise<void> {
    const yes = await this.confirmation.ask({
      title: `Remove ${team.name}?`,
      message: 'The team has no people and no projects left.',
      confirm: 'Remove team',
      keep: 'Keep it',
      destructive: true,
    });
    if (!yes) return;
    try {
      await this.adminApi.deleteTeam(team.id);
      this.teams.update((list) => list?.filter((t) => t.id !== team.id) ?? null);
    } catch (err) {
      this.failureNotice.show(err);
    }
  }
}
