import { ChangeDetectionStrategy, Component, effect, inject, input, output, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { type AllowanceStatus, allowanceLimitsSchema } from '../../../../../shared/schemas/allowance';
import { toApiFailure } from '../../core/api-failure';
import { fieldMessage, schemaIssues, showIssues } from '../../core/schema-issues';
import { AdminApi } from './admin-api';

/** The three limits of one team's allowance, CPU time entered in hours; closes with the new status. */
@Component({
  selector: 'app-allowance-editor',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatInputModule],
  template: `
    <form [formGroup]="form" (ngSubmit)="save()" novalidate class="editor" [attr.aria-label]="'Allowance of ' + allowance().teamName">
      <mat-form-field>
        <mat-label>CPU hours per month</mat-label>
        <input matInput type="number" min="0" step="0.01" formControlName="cpuHoursPerMonth" />
        <mat-error>{{ message('cpuHoursPerMonth') }}</mat-error>
      </mat-form-field>
      <mat-form-field>
        <mat-label>Sweeps at once</mat-label>
        <input matInput type="number" min="0" formControlName="sweepsAtOnce" />
        <mat-error>{{ message('sweepsAtOnce') }}</mat-error>
      </mat-form-field>
      <mat-form-field>
        <mat-label>Subsets per sweep</mat-label>
        <input matInput type="number" min="0" formControlName="subsetsPerSweep" />
        <mat-error>{{ message('subsetsPerSweep') }}</mat-error>
      </mat-form-field>
      <div class="buttons">
        <button mat-button type="button" (click)="closed.emit(null)">Back</button>
        <button mat-flat-button type="submit" [disabled]="pending()">Save limits</button>
      </div>
      @if (failure(); as message) {
        <p class="field-error whole" role="alert">{{ message }}</p>
      }
    </form>
  `,
  styles: `
    .editor { display: grid; grid-template-columns: repeat(3, minmax(0, 1fr)) auto; gap: 12px; align-items: start; padding: 12px 0 4px; }
    .buttons { display: flex; gap: 4px; padding-top: 8px; }
    .whole { grid-column: 1 / -1; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AllowanceEditor {
  private readonly adminApi = inject(AdminApi);
  readonly allowance = input.required<AllowanceStatus>();
  readonly closed = output<AllowanceStatus | null>();
  protected readonly form = inject(FormBuilder).nonNullable.group({ cpuHoursPerMonth: [0], sweepsAtOnce: [0], subsetsPerSweep: [0] });
  protected readonly pending = signal(false);
  protected readonly failure = signal<string | null>(null);

  constructor() {
    effect(() => {
      const a = this.allowance();
      this.form.setValue({ cpuHoursPerMonth: Math.round((a.cpuSecondsPerMonth / 3600) * 100) / 100, sweepsAtOnce: a.sweepsAtOnce, subsetsPerSweep: a.subsetsPerSweep });
    });
  }

  protected message(path: string): string {
    return fieldMessage(this.form.get(path));
  }

  private limits() {
    const v = this.form.getRawValue();
    return { cpuSecondsPerMonth: Math.round(Number(v.cpuHoursPerMonth) * 3600), sweepsAtOnce: Number(v.sweepsAtOnce), subsetsPerSweep: Number(v.subsetsPerSweep) };
  }

  /** The schema speaks of CPU seconds; its message goes under the hours field. */
  private show(issues: Record<string, string>): void {
    const { cpuSecondsPerMonth, ...rest } = issues;
    showIssues(this.form, { ...rest, ...(cpuSecondsPerMonth ? { cpuHoursPerMonth: cpuSecondsPerMonth } : {}) });
  }

  protected async save(): Promise<void> {
    this.form.markAllAsTouched();
    const limits = this.limits();
    const issues = schemaIssues(allowanceLimitsSchema, limits);
    this.show(issues);
    if (Object.keys(issues).length || this.pending()) return;
    this.pending.set(true);
    this.failure.set(null);
    try {
      this.closed.emit(await this.adminApi.updateAllowance(this.allowance().teamId, limits));
    } catch (err) {
      const failure = toApiFailure(err);
      this.show(failure.fields);
      this.failure.set(failure.message);
    } finally {
      this.pending.set(false);
    }
  }
}
