import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { FitResidual, FitResiduals } from '../../../../../shared/schemas/model-details';
import type { ChartSeries } from '../../shared/charts/line-chart';
import { LineChart } from '../../shared/charts/line-chart';
import { FigurePipe, formatFigure } from '../../shared/format/figure-pipe';

/** The residual against what it balances: the input power where there is any, else the energy's parts. */
function relativeSize(r: FitResidual): string {
  if (r.powerRms > 0) return `${formatFigure(r.rms / r.powerRms)} of the power`;
  return r.partsRms > 0 ? `${formatFigure(r.rms / r.partsRms)} of the energy's parts` : '–';
}

/**
 * How well the model's energy balances the recorded input power, recording by recording, in the rows the
 * sweep fitted: per sample (derivative form) or per window, plotted at the window's end (balance form). A
 * correct energy leaves only what the derivative estimates leave; a wrong term shows as structure over time.
 */
@Component({
  selector: 'app-fit-residual-view',
  imports: [LineChart, FigurePipe],
  template: `
    <p class="section-note">{{ explanation() }}</p>
    <table class="plain" aria-label="Fit residual per recording" data-test="fit-residual-figures">
      <thead>
        <tr><th scope="col">Recording</th><th scope="col">Rows</th><th scope="col">RMS residual</th><th scope="col">Largest</th><th scope="col">RMS relative</th></tr>
      </thead>
      <tbody>
        @for (r of residuals().recordings; track r.recording) {
          <tr>
            <th scope="row">{{ r.recording }} <span class="muted">({{ r.role === 'validate' ? 'validation' : 'training' }})</span></th>
            <td>{{ r.rows }}</td>
            <td>{{ r.rms | figure }}</td>
            <td>{{ r.max | figure }}</td>
            <td>{{ relative(r) }}</td>
          </tr>
        }
      </tbody>
    </table>
    <figure>
      <figcaption>Residual over time</figcaption>
      <app-line-chart [series]="series()" xLabel="time" [yLabel]="yLabel()" [height]="240" [marks]="zero" ariaLabel="Fit residual of the energy balance over time" />
    </figure>
  `,
  styles: `
    figure { margin: 14px 0 0; min-width: 0; }
    figcaption { font: var(--mat-sys-title-small); margin-bottom: 4px; }
    .plain { width: 100%; border-collapse: collapse; font-variant-numeric: tabular-nums; }
    .plain th, .plain td { padding: 6px 10px; text-align: right; border-bottom: 1px solid var(--mat-sys-outline-variant); }
    .plain th:first-child { text-align: left; font-weight: 400; }
    .plain thead th { font: var(--mat-sys-label-medium); color: var(--mat-sys-on-surface-variant); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FitResidualView {
  readonly residuals = input.required<FitResiduals>();

  protected readonly zero = [{ label: '0', y: 0 }];
  protected readonly relative = relativeSize;
  protected readonly series = computed((): ChartSeries[] =>
    this.residuals().recordings.map((r) => ({ name: r.recording, x: r.time, y: r.residual })),
  );
  protected readonly yLabel = computed(() => (this.residuals().form === 'derivative' ? 'dE/dt − P' : 'ΔE − ∫P dt'));
  protected readonly explanation = computed(() => {
    const { form, balance } = this.residuals();
    return form === 'derivative'
      ? 'Derivative form, as the sweep fitted: at each sample, the rate of change of the model’s energy less the input power. RMS over every sample; the plot is thinned.'
      : `Balance form, as the sweep fitted: over windows of ${balance?.window ?? '–'} sample intervals every ${balance?.stride ?? '–'} samples, the change of the model’s energy less the integrated input power, plotted at the end of each window. RMS over every window; the plot is thinned.`;
  });
}
