import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { CsvTable } from '../../../../../shared/math/csv-recording';
import { samplingStatistics } from '../../../../../shared/math/sampling-statistics';
import { thinnedIndices } from '../../../../../shared/math/thinned-indices';
import type { RecordingMappingInput } from '../../../../../shared/schemas/recording';
import type { ChartSeries } from '../../shared/charts/line-chart';
import { LineChart } from '../../shared/charts/line-chart';
import { CountPipe } from '../../shared/format/count-pipe';
import { FigurePipe } from '../../shared/format/figure-pipe';

/** Points per plotted channel at most; every k-th sample is drawn beyond that (the last one always). */
const plotPoints = 1500;
const decimalNumber = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** A column's numbers; cells that are not numbers are null (the upload names them, this only draws). */
function columnNumbers(table: CsvTable, column: string): (number | null)[] | null {
  const c = table.header.indexOf(column);
  if (c < 0) return null;
  return table.rows.map((row) => (decimalNumber.test(row[c] ?? '') ? Number(row[c]) : null));
}

/**
 * The file as mapped, before it is uploaded: sampling statistics of the time column (the same shared
 * functions the server uses) and a plot of every mapped channel against time, following the mapping as it
 * is edited.
 */
@Component({
  selector: 'app-mapping-preview',
  imports: [LineChart, CountPipe, FigurePipe],
  template: `
    @if (stats(); as s) {
      <dl class="stat-grid" data-test="preview-stats">
        <div class="stat"><dt>Samples</dt><dd>{{ s.sampleCount | count }}</dd></div>
        <div class="stat"><dt>Sample rate</dt><dd>{{ s.sampleRate === null ? '–' : (s.sampleRate | figure: 4) + ' per ' + timeUnit() }}</dd></div>
        <div class="stat"><dt>Median step</dt><dd>{{ s.steps ? (s.steps.median | figure: 4) : '–' }}</dd></div>
        <div class="stat"><dt>Evenly sampled</dt><dd>{{ s.uniform ? 'Yes' : 'No' }}</dd></div>
        <div class="stat" [class.warn]="s.gapCount > 0"><dt>Gaps</dt><dd>{{ s.gapCount | count }}</dd></div>
      </dl>
    } @else {
      <p class="muted">Choose a time column with a number in every row to see the sampling.</p>
    }
    @if (plots().length) {
      <div class="plots">
        @for (plot of plots(); track plot.title) {
          <figure>
            <figcaption>{{ plot.title }}</figcaption>
            <app-line-chart [series]="plot.series" [xLabel]="'time (' + timeUnit() + ')'" [height]="170" [ariaLabel]="'Preview of ' + plot.title" />
          </figure>
        }
      </div>
    }
  `,
  styles: `
    .stat-grid { margin-bottom: 14px; }
    .warn dd { color: #8a5a00; }
    .plots { display: grid; grid-template-columns: repeat(auto-fill, minmax(420px, 1fr)); gap: 12px 20px; }
    figure { margin: 0; min-width: 0; }
    figcaption { font: var(--mat-sys-title-small); margin-bottom: 2px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MappingPreview {
  readonly table = input.required<CsvTable>();
  readonly mapping = input.required<RecordingMappingInput>();

  protected readonly timeUnit = computed(() => this.mapping().time.unit || 's');
  private readonly time = computed(() => {
    const values = columnNumbers(this.table(), this.mapping().time.column);
    return values && values.every((v) => v !== null) ? (values as number[]) : null;
  });
  protected readonly stats = computed(() => {
    const time = this.time();
    return time ? samplingStatistics([time]) : null;
  });
  protected readonly plots = computed(() => {
    const time = this.time();
    if (!time) return [];
    const { indices } = thinnedIndices(time.length, plotPoints);
    const thinned = <T,>(values: readonly T[]) => indices.map((k) => values[k]!);
    const x = thinned(time);
    const plot = (title: string, column: string | undefined): { title: string; series: ChartSeries[] } | null => {
      const values = column ? columnNumbers(this.table(), column) : null;
      return values ? { title: `${title} · ${column}`, series: [{ name: title, x, y: thinned(values) }] } : null;
    };
    return this.mapping()
      .coordinates.flatMap((c) => [
        plot(`position of ${c.name}${c.unit ? ` (${c.unit})` : ''}`, c.column),
        plot(`velocity of ${c.name}`, c.velocity?.column),
        plot(`force on ${c.name}`, c.force?.column),
      ])
      .filter((p): p is { title: string; series: ChartSeries[] } => p !== null);
  });
}
