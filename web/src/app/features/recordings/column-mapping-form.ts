import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { RecordingInspection } from '../../../../../shared/schemas/recording';
import { fieldMessage } from '../../core/schema-issues';
import type { MappingForm } from './mapping-form-model';

/**
 * Which column holds what: the time, and per coordinate its position, optionally a measured velocity and the
 * force acting on it, each with its unit. Messages from the shared schema (or the server) sit under each field.
 */
@Component({
  selector: 'app-column-mapping-form',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, MatTooltipModule],
  template: `
    <div [formGroup]="form()">
      <div class="form-grid top">
        <mat-form-field>
          <mat-label>Recording name</mat-label>
          <input matInput formControlName="name" [placeholder]="defaultName()" />
          <mat-hint>Left empty, the file name is used.</mat-hint>
          <mat-error>{{ message('name') }}</mat-error>
        </mat-form-field>
        <ng-container formGroupName="time">
          <mat-form-field>
            <mat-label>Time column</mat-label>
            <mat-select formControlName="column">
              @for (column of inspection().header; track column) {
                <mat-option [value]="column">{{ column }}{{ numeric().has(column) ? '' : ' (has text cells)' }}</mat-option>
              }
            </mat-select>
            <mat-error>{{ message('time.column') }}</mat-error>
          </mat-form-field>
          <mat-form-field class="unit">
            <mat-label>Time unit</mat-label>
            <input matInput formControlName="unit" />
            <mat-error>{{ message('time.unit') }}</mat-error>
          </mat-form-field>
        </ng-container>
      </div>

      <h3 class="section-title">Coordinates</h3>
      <p class="section-note">One row per generalized coordinate. Terms use its name for the position and d&lt;name&gt; for its velocity.</p>
      <ol class="coordinates" formArrayName="coordinates">
        @for (coordinate of form().controls.coordinates.controls; track coordinate; let i = $index) {
          <li class="coordinate" [formGroupName]="i" [attr.aria-label]="'Coordinate ' + (i + 1)">
            <mat-form-field class="name">
              <mat-label>Name</mat-label>
              <input matInput formControlName="name" />
              <mat-error>{{ message('coordinates.' + i + '.name') }}</mat-error>
            </mat-form-field>
            <mat-form-field>
              <mat-label>Position column</mat-label>
              <mat-select formControlName="column">
                @for (column of inspection().header; track column) {
                  <mat-option [value]="column">{{ column }}{{ numeric().has(column) ? '' : ' (has text cells)' }}</mat-option>
                }
              </mat-select>
              <mat-error>{{ message('coordinates.' + i + '.column') }}</mat-error>
            </mat-form-field>
            <mat-form-field class="unit">
              <mat-label>Unit</mat-label>
              <input matInput formControlName="unit" />
              <mat-error>{{ message('coordinates.' + i + '.unit') }}</mat-error>
            </mat-form-field>
            <ng-container formGroupName="velocity">
              <mat-form-field>
                <mat-label>Velocity column</mat-label>
                <mat-select formControlName="column">
                  <mat-option value="">Estimated</mat-option>
                  @for (column of inspection().header; track column) {
                    <mat-option [value]="column">{{ column }}</mat-option>
                  }
                </mat-select>
                <mat-error>{{ message('coordinates.' + i + '.velocity.column') }}</mat-error>
              </mat-form-field>
            </ng-container>
            <ng-container formGroupName="force">
              <mat-form-field>
                <mat-label>Force column</mat-label>
                <mat-select formControlName="column">
                  <mat-option value="">None</mat-option>
                  @for (column of inspection().header; track column) {
                    <mat-option [value]="column">{{ column }}</mat-option>
                  }
                </mat-select>
                <mat-error>{{ message('coordinates.' + i + '.force.column') }}</mat-error>
              </mat-form-field>
              <mat-form-field class="unit">
                <mat-label>Force unit</mat-label>
                <input matInput formControlName="unit" />
                <mat-error>{{ message('coordinates.' + i + '.force.unit') }}</mat-error>
              </mat-form-field>
            </ng-container>
            <button
              mat-icon-button
              type="button"
              class="remove"
              (click)="remove.emit(i)"
              [disabled]="form().controls.coordinates.length === 1"
              [attr.aria-label]="'Remove coordinate ' + (i + 1)"
              matTooltip="Remove this coordinate"
            >
              <mat-icon>delete</mat-icon>
            </button>
          </li>
        }
      </ol>
      @if (message('coordinates'); as problem) {
        <p class="field-error" role="alert">{{ problem }}</p>
      }
      <button mat-stroked-button type="button" (click)="add.emit()" [disabled]="form().controls.coordinates.length >= 8">
        <mat-icon>add</mat-icon> Add coordinate
      </button>
    </div>
  `,
  styles: `
    .top { grid-template-columns: 2fr 2fr 1fr; margin-bottom: 8px; }
    .coordinates { margin: 0 0 12px; padding: 0; list-style: none; display: grid; gap: 4px; }
    .coordinate {
      display: grid; grid-template-columns: 1.1fr 1.6fr 0.8fr 1.6fr 1.6fr 0.8fr 40px; gap: 0 10px; align-items: start;
      padding: 12px 8px 4px 12px; border-radius: var(--mat-sys-corner-medium); background: var(--mat-sys-surface-container-low);
    }
    .remove { margin-top: 4px; }
    @media (max-width: 1100px) { .coordinate { grid-template-columns: repeat(3, 1fr) 40px; } }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ColumnMappingForm {
  readonly form = input.required<MappingForm>();
  readonly inspection = input.required<RecordingInspection>();
  readonly add = output<void>();
  readonly remove = output<number>();

  protected readonly numeric = computed(() => new Set(this.inspection().numericColumns));
  protected readonly defaultName = computed(() => this.inspection().fileName.replace(/\.[^.]*$/, ''));

  protected message(path: string): string {
    return fieldMessage(this.form().get(path));
  }
}
