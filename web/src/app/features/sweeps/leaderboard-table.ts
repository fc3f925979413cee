import { ChangeDetectionStrategy, Component, computed, effect, input, signal, viewChild } from '@angular/core';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import type { LeaderboardEntry, SweepLeaderboard } from '../../../../../shared/schemas/sweep-leaderboard';
import { FigurePipe } from '../../shared/format/figure-pipe';
import { MathFormula } from '../../shared/math/math-formula';

interface BoardRow extends LeaderboardEntry {
  rank: number;
}

/**
 * The leaderboard as a sortable table, overall or for one size: each row the energy with its coefficients
 * typeset, its terms, and its residuals. New versions from the live view replace the rows in place.
 */
@Component({
  selector: 'app-leaderboard-table',
  imports: [MatButtonToggleModule, MatSortModule, MatTableModule, FigurePipe, MathFormula],
  template: `
    <div class="head">
      <mat-button-toggle-group hideSingleSelectionIndicator [value]="view()" (change)="view.set($event.value)" aria-label="Which leaderboard">
        <mat-button-toggle value="overall">Overall</mat-button-toggle>
        @for (size of sizes(); track size) {
          <mat-button-toggle [value]="size">Size {{ size }}</mat-button-toggle>
        }
      </mat-button-toggle-group>
    </div>
    <div class="scroller">
      <table mat-table [dataSource]="source" matSort class="data-table" aria-label="Leaderboard" data-test="leaderboard">
        <ng-container matColumnDef="rank">
          <th mat-header-cell *matHeaderCellDef mat-sort-header class="narrow">#</th>
          <td mat-cell *matCellDef="let row" class="narrow">{{ row.rank }}</td>
        </ng-container>
        <ng-container matColumnDef="size">
          <th mat-header-cell *matHeaderCellDef mat-sort-header class="narrow">Size</th>
          <td mat-cell *matCellDef="let row" class="narrow">{{ row.size }}</td>
        </ng-container>
        <ng-container matColumnDef="energy">
          <th mat-header-cell *matHeaderCellDef>Energy: terms and coefficients (4 digits)</th>
          <td mat-cell *matCellDef="let row" class="energy">
            <app-math [combination]="row" [coordinates]="coordinates()" [ariaLabel]="row.energy" />
          </td>
        </ng-container>
        <ng-container matColumnDef="rss">
          <th mat-header-cell *matHeaderCellDef mat-sort-header class="numeric">Sum of squares</th>
          <td mat-cell *matCellDef="let row" class="numeric">{{ row.rss | figure: 4 }}</td>
        </ng-container>
        <ng-container matColumnDef="rmse">
          <th mat-header-cell *matHeaderCellDef mat-sort-header class="numeric">RMS residual</th>
          <td mat-cell *matCellDef="let row" class="numeric">{{ row.rmse | figure: 4 }}</td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let row; columns: columns" data-test="leaderboard-row"></tr>
        <tr class="mat-mdc-row" *matNoDataRow>
          <td class="mat-mdc-cell empty" [attr.colspan]="columns.length">No subset has been scored yet.</td>
        </tr>
      </table>
    </div>
  `,
  styles: `
    .head { display: flex; flex-wrap: wrap; gap: 8px; margin-bottom: 8px; }
    .scroller { overflow-x: auto; }
    .narrow { width: 48px; }
    .energy { min-width: 320px; padding-top: 8px; padding-bottom: 8px; }
    .empty { padding: 16px; color: var(--mat-sys-on-surface-variant); }
    mat-button-toggle-group { --mat-button-toggle-height: 32px; font: var(--mat-sys-label-large); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LeaderboardTable {
  readonly leaderboard = input.required<SweepLeaderboard>();
  readonly coordinates = input.required<readonly string[]>();
  private readonly sort = viewChild.required(MatSort);

  protected readonly columns = ['rank', 'size', 'energy', 'rss', 'rmse'];
  protected readonly view = signal<'overall' | number>('overall');
  protected readonly sizes = computed(() => this.leaderboard().bySize.map((s) => s.size));
  protected readonly source = new MatTableDataSource<BoardRow>([]);

  constructor() {
    effect(() => {
      const board = this.leaderboard();
      const view = this.view();
      const entries = view === 'overall' ? board.overall : (board.bySize.find((s) => s.size === view)?.entries ?? []);
      this.source.data = entries.map((entry, i) => ({ ...entry, rank: i + 1 }));
      this.source.sort = this.sort();
    });
  }
}
