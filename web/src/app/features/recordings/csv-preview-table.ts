import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { RecordingInspection } from '../../../../../shared/schemas/recording';

/** The place in the file a refusal names: 1-based data row and column name, either may be unknown. */
export interface CsvFault {
  row: number | null;
  column: string | null;
}

/**
 * The first rows of an uploaded file as a table, with the roles the mapping gives each column in the header,
 * and the row and column a refusal names marked.
 */
@Component({
  selector: 'app-csv-preview-table',
  template: `
    <div class="scroller" tabindex="0" role="region" aria-label="First rows of the file">
      <table class="preview">
        <thead>
          <tr>
            <th scope="col" class="row-number">Row</th>
            @for (column of inspection().header; track $index) {
              <th scope="col" [class.fault]="column === fault()?.column" [class.unused]="!roles()[column]">
                <span class="column">{{ column }}</span>
                <span class="role">{{ roles()[column] || (numeric().has(column) ? 'not mapped' : 'not numeric') }}</span>
              </th>
            }
          </tr>
        </thead>
        <tbody>
          @for (row of inspection().previewRows; track $index; let r = $index) {
            <tr [class.fault]="r + 1 === fault()?.row">
              <th scope="row" class="row-number">{{ r + 1 }}</th>
              @for (cell of row; track $index; let c = $index) {
                <td [class.fault]="r + 1 === fault()?.row && inspection().header[c] === fault()?.column" [class.unused]="!roles()[inspection().header[c]]">{{ cell }}</td>
              }
            </tr>
          }
        </tbody>
      </table>
    </div>
    <p class="muted note">
      Showing {{ inspection().previewRows.length }} of {{ inspection().rowCount }} data rows.
      @if (faultOutsidePreview()) {
        The row at fault, {{ fault()?.row }}, is further down the file.
      }
    </p>
  `,
  styles: `
    .scroller { overflow-x: auto; border: 1px solid var(--mat-sys-outline-variant); border-radius: var(--mat-sys-corner-medium); }
    .preview { border-collapse: collapse; width: 100%; font: var(--mat-sys-body-medium); font-variant-numeric: tabular-nums; }
    th, td { padding: 6px 12px; border-bottom: 1px solid var(--mat-sys-outline-variant); text-align: right; white-space: nowrap; }
    thead th { position: sticky; top: 0; background: var(--mat-sys-surface-container); text-align: right; vertical-align: bottom; }
    .column { display: block; font: var(--mat-sys-title-small); }
    .role { display: block; font: var(--mat-sys-label-small); color: var(--mat-sys-primary); }
    .unused, .unused .role { color: var(--mat-sys-on-surface-variant); }
    .row-number { color: var(--mat-sys-on-surface-variant); font-weight: 400; text-align: left; }
    tr.fault { background: color-mix(in srgb, var(--mat-sys-error-container) 45%, transparent); }
    th.fault, td.fault { background: var(--mat-sys-error-container); color: var(--mat-sys-on-error-container); outline: 2px solid var(--mat-sys-error); outline-offset: -2px; }
    .note { margin: 6px 0 0; font: var(--mat-sys-body-small); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CsvPreviewTable {
  readonly inspection = input.required<RecordingInspection>();
  /** What each column is mapped to (`time`, `position of x`, ...), by column name. */
  readonly roles = input<Record<string, string>>({});
  readonly fault = input<CsvFault | null>(null);

  protected readonly numeric = computed(() => new Set(this.inspection().numericColumns));
  protected readonly faultOutsidePreview = computed(() => {
    const row = this.fault()?.row;
    return row !== null && row !== undefined && row > this.inspection().previewRows.length;
  });
}
