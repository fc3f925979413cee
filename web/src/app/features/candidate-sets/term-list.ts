import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { TermVerdict } from '../../../../../shared/schemas/candidate-set';
import { MathFormula } from '../../shared/math/math-formula';
import { type TermRole, type TermRow, familyLabels } from './term-row';

const roleLabels: Record<TermRole, string> = { candidate: 'Candidate', known: 'Known', reference: 'Reference' };

/**
 * The terms of a candidate set, each typeset, with its role (candidate, known, reference), the check's
 * verdict underneath, and a remove button. Read-only for viewers.
 */
@Component({
  selector: 'app-term-list',
  imports: [MatButtonModule, MatButtonToggleModule, MatIconModule, MatTooltipModule, MathFormula],
  template: `
    <ol class="terms" aria-label="Terms">
      @for (row of rows(); track row.id; let i = $index) {
        @let verdict = verdicts().get(row.id);
        @let problem = serverErrors().get(row.id) ?? verdict?.error ?? null;
        <li class="term" [class.known]="row.role === 'known'" [class.reference]="row.role === 'reference'" [class.bad]="problem" [attr.aria-label]="'Term ' + row.text" data-test="term-row">
          <span class="index" aria-hidden="true">{{ i + 1 }}</span>
          <div class="body">
            <div class="line">
              <app-math class="formula" [expression]="row.text" [coordinates]="coordinates()" />
              <code class="typed">{{ row.text }}</code>
              @if (row.family) {
                <span class="family">{{ familyLabel(row) }}</span>
              }
            </div>
            @if (problem) {
              <p class="verdict error" role="alert">{{ problem }}</p>
            } @else if (verdict?.excluded) {
              <p class="verdict excluded">{{ verdict?.excluded }}</p>
            }
          </div>
          @if (readOnly()) {
            @if (row.role !== 'candidate') {
              <span class="role-label">{{ roleLabel(row.role) }}</span>
            }
          } @else {
            <mat-button-toggle-group
              class="roles"
              hideSingleSelectionIndicator
              [value]="row.role"
              (change)="role.emit({ id: row.id, role: $event.value })"
              [attr.aria-label]="'Role of ' + row.text"
            >
              <mat-button-toggle value="candidate">Candidate</mat-button-toggle>
              <mat-button-toggle value="known">Known</mat-button-toggle>
              <mat-button-toggle value="reference">Reference</mat-button-toggle>
            </mat-button-toggle-group>
            <button mat-icon-button type="button" (click)="remove.emit(row.id)" [attr.aria-label]="'Remove ' + row.text" matTooltip="Remove this term">
              <mat-icon>close</mat-icon>
            </button>
          }
        </li>
      }
    </ol>
  `,
  styles: `
    .terms { margin: 0; padding: 0; list-style: none; }
    .term {
      display: grid; grid-template-columns: 32px minmax(0, 1fr) auto auto; gap: 10px; align-items: center;
      padding: 6px 4px 6px 8px; border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .term.known { background: color-mix(in srgb, var(--mat-sys-primary-container) 35%, transparent); box-shadow: inset 3px 0 var(--mat-sys-primary); }
    .term.reference { background: color-mix(in srgb, var(--mat-sys-tertiary-container) 45%, transparent); box-shadow: inset 3px 0 var(--mat-sys-tertiary); }
    .term.known .roles {
      --mat-button-toggle-selected-state-background-color: var(--mat-sys-primary);
      --mat-button-toggle-selected-state-text-color: var(--mat-sys-on-primary);
    }
    .term.reference .roles {
      --mat-button-toggle-selected-state-background-color: var(--mat-sys-tertiary);
      --mat-button-toggle-selected-state-text-color: var(--mat-sys-on-tertiary);
    }
    .term.bad { background: color-mix(in srgb, var(--mat-sys-error-container) 50%, transparent); }
    .index { color: var(--mat-sys-on-surface-variant); font: var(--mat-sys-label-medium); text-align: right; }
    .line { display: flex; align-items: baseline; gap: 14px; flex-wrap: wrap; min-width: 0; }
    .formula { font-size: 1.08em; min-width: 90px; }
    .typed { color: var(--mat-sys-on-surface-variant); font-size: 0.85em; }
    .family {
      padding: 0 8px; border-radius: 999px; background: var(--mat-sys-surface-container-high); color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-label-small); line-height: 18px;
    }
    .verdict { margin: 2px 0 0; font: var(--mat-sys-body-small); }
    .verdict.error { color: var(--mat-sys-error); }
    .verdict.excluded { color: var(--mat-sys-on-surface-variant); font-style: italic; }
    .roles { --mat-button-toggle-height: 30px; --mat-button-toggle-label-text-size: 13px; }
    .role-label { font: var(--mat-sys-label-large); color: var(--mat-sys-primary); padding-right: 8px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TermList {
  readonly rows = input.required<readonly TermRow[]>();
  readonly coordinates = input.required<readonly string[]>();
  readonly verdicts = input<ReadonlyMap<number, TermVerdict>>(new Map());
  readonly serverErrors = input<ReadonlyMap<number, string>>(new Map());
  readonly readOnly = input(false);
  readonly role = output<{ id: number; role: TermRole }>();
  readonly remove = output<number>();

  protected familyLabel(row: TermRow): string {
    return row.family ? familyLabels[row.family] : '';
  }

  protected roleLabel(role: TermRole): string {
    return roleLabels[role];
  }
}
