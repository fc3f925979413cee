import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { projectInputSchema, type ProjectSummary } from '../../../../../shared/schemas/project';
import { toApiFailure } from '../../core/api-failure';
import { zodValidator } from '../../core/zod-validator';
import { ProjectsApi } from './projects-api';

/** Starts a project for a mechanism in the user's team; closes with the new project. */
@Component({
  selector: 'app-new-project-dialog',
  imports: [ReactiveFormsModule, MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule],
  template: `
    <h2 mat-dialog-title>New project</h2>
    <form [formGroup]="form" (ngSubmit)="create()" novalidate>
      <mat-dialog-content>
        <p class="lead">One project per mechanism: its recordings, candidate sets and sweeps stay together.</p>
        @if (failure(); as message) {
          <p class="field-error" role="alert">{{ message }}</p>
        }
        <mat-form-field>
          <mat-label>Name</mat-label>
          <input matInput formControlName="name" required cdkFocusInitial />
          <mat-error>{{ form.controls.name.errors?.['server'] ?? form.controls.name.errors?.['schema'] }}</mat-error>
        </mat-form-field>
        <mat-form-field>
          <mat-label>Description</mat-label>
          <textarea matInput formControlName="description" rows="3" placeholder="What the mechanism is and what was measured"></textarea>
          <mat-error>{{ form.controls.description.errors?.['server'] ?? form.controls.description.errors?.['schema'] }}</mat-error>
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Back</button>
        <button mat-flat-button type="submit" [disabled]="pending()">Create project</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    mat-form-field { width: 100%; }
    .lead { margin: 0 0 16px; color: var(--mat-sys-on-surface-variant); }
    mat-dialog-content { width: min(480px, 80vw); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NewProjectDialog {
  private readonly projectsApi = inject(ProjectsApi);
  private readonly dialog = inject<MatDialogRef<NewProjectDialog, ProjectSummary>>(MatDialogRef);
  protected readonly form = inject(FormBuilder).nonNullable.group({
    name: ['', zodValidator(projectInputSchema.shape.name)],
    description: ['', zodValidator(projectInputSchema.shape.description)],
  });
  protected readonly pending = signal(false);
  protected readonly failure = signal<string | null>(null);

  protected async create(): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.invalid || this.pending()) return;
    this.pending.set(true);
    this.failure.set(null);
    try {
      this.dialog.close(await this.projectsApi.create(this.form.getRawValue()));
    } catch (err) {
      const failure = toApiFailure(err);
      for (const [field, message] of Object.entries(failure.fields)) this.form.get(field)?.setErrors({ server: message });
      if (!Object.keys(failure.fields).length) this.failure.set(failure.message);
    } finally {
      this.pending.set(false);
    }
  }
}
