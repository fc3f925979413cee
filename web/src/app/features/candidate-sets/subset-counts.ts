import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { binomial } from '../../../../../shared/math/combinations';
import { formatCount } from '../../shared/format/count-pipe';

/** Sizes shown by default: beyond this the counts grow past anything a sweep would take on. */
const shownSizes = 8;

/**
 * How many subsets a sweep would try at each size (candidate terms beyond the known ones), and how many in
 * total up to that size, from the number of candidates the check leaves. Updates as the set is edited.
 */
@Component({
  selector: 'app-subset-counts',
  template: `
    <table class="counts" aria-label="Subsets per size">
      <thead>
        <tr><th scope="col">Size</th><th scope="col">Subsets</th><th scope="col">Up to this size</th></tr>
      </thead>
      <tbody>
        @for (row of rows(); track row.size) {
          <tr>
            <th scope="row">{{ row.size }}</th>
            <td data-test="subsets-at-size">{{ row.count }}</td>
            <td>{{ row.total }}</td>
          </tr>
        } @empty {
          <tr><td colspan="3" class="muted">No candidates yet.</td></tr>
        }
      </tbody>
    </table>
    <p class="note muted">
      Size counts candidate terms beyond the {{ known() }} known {{ known() === 1 ? 'term' : 'terms' }}{{ hasReference() ? ' and the reference term' : '' }}, which every model keeps.
    </p>
  `,
  styles: `
    .counts { width: 100%; border-collapse: collapse; font-variant-numeric: tabular-nums; }
    th, td { padding: 5px 8px; text-align: right; border-bottom: 1px solid var(--mat-sys-outline-variant); }
    thead th { font: var(--mat-sys-label-medium); color: var(--mat-sys-on-surface-variant); }
    tbody th { font-weight: 500; }
    .note { margin: 8px 0 0; font: var(--mat-sys-body-small); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SubsetCounts {
  readonly candidates = input.required<number>();
  readonly known = input(0);
  readonly hasReference = input(false);

  protected readonly rows = computed(() => {
    const n = this.candidates();
    const rows: { size: number; count: string; total: string }[] = [];
    let total = 0;
    let overflow = false;
    for (let size = 1; size <= Math.min(n, shownSizes); size++) {
      let count: number;
      try {
        count = binomial(n, size);
      } catch {
        overflow = true;
        count = Infinity;
      }
      total += count;
      rows.push({ size, count: overflow ? 'beyond 9 quadrillion' : formatCount(count), total: overflow ? '–' : formatCount(total) });
    }
    return rows;
  });
}
