import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { roles } from '../../../../../shared/schemas/session';
import type { AdminTeam } from '../../../../../shared/schemas/team-admin';
import { type AdminUser, type UserCreate, userCreateSchema } from '../../../../../shared/schemas/user-admin';
import { toApiFailure } from '../../core/api-failure';
import { fieldMessage } from '../../core/schema-issues';
import { zodValidator } from '../../core/zod-validator';
import { roleLabel } from '../../shell/role-label';
import { AdminApi } from './admin-api';

/** Creates an account with its team and role; closes with the new user. */
@Component({
  selector: 'app-new-user-dialog',
  imports: [ReactiveFormsModule, MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatSelectModule],
  template: `
    <h2 mat-dialog-title>Add a user</h2>
    <form [formGroup]="form" (ngSubmit)="create()" novalidate>
      <mat-dialog-content class="fields">
        @if (failure(); as message) {
          <p class="field-error" role="alert">{{ message }}</p>
        }
        <mat-form-field>
          <mat-label>Name</mat-label>
          <input matInput formControlName="name" required />
          <mat-error>{{ message('name') }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>E-mail address</mat-label>
          <input matInput type="email" formControlName="email" required />
          <mat-error>{{ message('email') }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>First password</mat-label>
          <input matInput type="password" formControlName="password" autocomplete="new-password" required />
          <mat-hint>At least 12 characters; tell the person by another channel.</mat-hint>
          <mat-error>{{ message('password') }}</mat-error>
        </mat-form-field>
        <div class="pair">
          <mat-form-field>
            <mat-label>Team</mat-label>
            <mat-select formControlName="teamId">
              @for (team of teams; track team.id) {
                <mat-option [value]="team.id">{{ team.name }}</mat-option>
              }
            </mat-select>
            <mat-error>{{ message('teamId') }}</mat-error>
          </mat-form-field>
          <mat-form-field>
            <mat-label>Role</mat-label>
            <mat-select formControlName="role">
              @for (role of roles; track role) {
                <mat-option [value]="role">{{ label(role) }}</mat-option>
              }
            </mat-select>
          </mat-form-field>
        </div>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Back</button>
        <button mat-flat-button type="submit" [disabled]="pending()">Add user</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .fields { display: grid; gap: 8px; width: min(460px, 80vw); }
    .pair { display: grid; grid-template-columns: 1fr 1fr; gap: 12px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NewUserDialog {
  private readonly adminApi = inject(AdminApi);
  private readonly dialog = inject<MatDialogRef<NewUserDialog, AdminUser>>(MatDialogRef);
  protected readonly teams = inject<AdminTeam[]>(MAT_DIALOG_DATA);
  protected readonly roles = roles;
  protected readonly form = inject(FormBuilder).nonNullable.group({
    name: ['', zodValidator(userCreateSchema.shape.name)],
    email: ['', zodValidator(userCreateSchema.shape.email)],
    password: ['', zodValidator(userCreateSchema.shape.password)],
    teamId: [this.teams[0]?.id ?? '', zodValidator(userCreateSchema.shape.teamId)],
    role: ['analyst' as UserCreate['role']],
  });
  protected readonly pending = signal(false);
  protected readonly failure = signal<string | null>(null);

  protected message(path: string): string {
    return fieldMessage(this.form.get(path));
  }

  protected label(role: UserCreate['role']): string {
    return roleLabel(role);
  }

  protected async create(): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.invalid || this.pending()) return;
    this.pending.set(true);
    this.failure.set(null);
    try {
      this.dialog.close(await this.adminApi.createUser(this.form.getRawValue()));
    } catch (err) {
      const failure = toApiFailure(err);
      for (const [field, message] of Object.entries(failure.fields)) this.form.get(field)?.setErrors({ server: message });
      this.failure.set(failure.message);
    } finally {
      this.pending.set(false);
    }
  }
}
