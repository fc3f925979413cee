import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import type { DiscoveryResult } from '../../../../../shared/schemas/discovery-result';
import { FigurePipe } from '../../shared/format/figure-pipe';
import { MathFormula } from '../../shared/math/math-formula';

/**
 * The models a finished sweep worked out, best first: the energy, the errors on training and validation data,
 * the information criterion and the conditioning, each with a link to its model view.
 */
@Component({
  selector: 'app-sweep-models',
  imports: [RouterLink, MatButtonModule, MatIconModule, MatTableModule, FigurePipe, MathFormula],
  template: `
    <div class="scroller">
      <table mat-table [dataSource]="result().models" class="data-table" aria-label="Worked-out models" data-test="models">
        <ng-container matColumnDef="model">
          <th mat-header-cell *matHeaderCellDef>Model</th>
          <td mat-cell *matCellDef="let m; let i = index">
            @if (i === 0) {
              <span class="best">Best</span>
            } @else {
              <span class="muted">{{ i + 1 }}</span>
            }
          </td>
        </ng-container>
        <ng-container matColumnDef="size">
          <th mat-header-cell *matHeaderCellDef class="numeric">Size</th>
          <td mat-cell *matCellDef="let m" class="numeric">{{ m.size }}</td>
        </ng-container>
        <ng-container matColumnDef="energy">
          <th mat-header-cell *matHeaderCellDef>Energy (coefficients to 4 digits)</th>
          <td mat-cell *matCellDef="let m" class="energy"><app-math [combination]="m" [coordinates]="coordinates()" [ariaLabel]="m.energy" /></td>
        </ng-container>
        <ng-container matColumnDef="train">
          <th mat-header-cell *matHeaderCellDef class="numeric">Training error</th>
          <td mat-cell *matCellDef="let m" class="numeric">{{ m.trainRmse | figure: 3 }}</td>
        </ng-container>
        <ng-container matColumnDef="validation">
          <th mat-header-cell *matHeaderCellDef class="numeric">Validation error</th>
          <td mat-cell *matCellDef="let m" class="numeric">{{ m.validationRmse | figure: 3 }}</td>
        </ng-container>
        <ng-container matColumnDef="bic">
          <th mat-header-cell *matHeaderCellDef class="numeric">BIC</th>
          <td mat-cell *matCellDef="let m" class="numeric">{{ m.bic | figure: 5 }}</td>
        </ng-container>
        <ng-container matColumnDef="condition">
          <th mat-header-cell *matHeaderCellDef class="numeric">Condition</th>
          <td mat-cell *matCellDef="let m" class="numeric">{{ m.conditionNumber | figure: 2 }}</td>
        </ng-container>
        <ng-container matColumnDef="open">
          <th mat-header-cell *matHeaderCellDef><span class="visually-hidden">Open</span></th>
          <td mat-cell *matCellDef="let m; let i = index">
            <a mat-stroked-button [routerLink]="['models', i]" [attr.aria-label]="'Open model ' + (i + 1)">
              Open <mat-icon iconPositionEnd>arrow_forward</mat-icon>
            </a>
          </td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let row; columns: columns; let i = index" [class.first]="i === 0"></tr>
      </table>
    </div>
    <p class="muted note">
      Ranked by {{ result().rankedBy === 'validation' ? 'the error on the validation recordings' : 'the Bayesian information criterion' }}; among
      models within {{ result().rankingTolerance | figure: 3 }} of the best score the smallest comes first.
    </p>
  `,
  styles: `
    .scroller { overflow-x: auto; }
    .energy { min-width: 280px; padding-top: 6px; padding-bottom: 6px; }
    .best { padding: 2px 10px; border-radius: 999px; background: var(--mat-sys-primary); color: var(--mat-sys-on-primary); font: var(--mat-sys-label-medium); }
    tr.first { background: color-mix(in srgb, var(--mat-sys-primary-container) 35%, transparent); }
    .note { margin: 10px 0 0; font: var(--mat-sys-body-small); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SweepModels {
  readonly result = input.required<DiscoveryResult>();
  readonly coordinates = input.required<readonly string[]>();
  protected readonly columns = ['model', 'size', 'energy', 'train', 'validation', 'bic', 'condition', 'open'];
}
