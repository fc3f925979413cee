import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { RecordingCheck } from '../../../../../shared/schemas/model-details';
import type { ChartSeries } from '../../shared/charts/line-chart';
import { LineChart } from '../../shared/charts/line-chart';
import { chartPalette } from '../../shared/charts/chart-palette';
import { DurationPipe } from '../../shared/format/duration-pipe';
import { FigurePipe } from '../../shared/format/figure-pipe';

const statusLabels = {
  finished: 'Simulated to the end of the recording',
  'singular-mass-matrix': 'Stopped: the mass matrix became singular',
  diverged: 'Stopped: the simulation diverged',
  'too-many-steps': 'Stopped: the integrator needed too many steps',
} as const;

/**
 * The model simulated from one recording's initial state: how long it stays within the threshold, errors per
 * coordinate, energy drift on passive runs, and plots of simulated against recorded positions and of the error
 * over time.
 */
@Component({
  selector: 'app-recording-check-view',
  imports: [MatIconModule, LineChart, DurationPipe, FigurePipe],
  template: `
    @let f = check().figures;
    <div class="head">
      <h3 class="name">{{ f.recording }} <span class="role">{{ f.role === 'validate' ? 'validation' : 'training' }}</span></h3>
      <span class="status" [class.bad]="f.status !== 'finished'">
        <mat-icon aria-hidden="true">{{ f.status === 'finished' ? 'check_circle' : 'error' }}</mat-icon>{{ statusLabel() }}
      </span>
    </div>
    @if (f.message) {
      <p class="muted small">{{ f.message }}</p>
    }
    <dl class="stat-grid">
      <div class="stat"><dt>Simulated</dt><dd>{{ f.start | figure: 4 }} to {{ f.end | figure: 4 }}</dd></div>
      <div class="stat"><dt>Within {{ f.threshold | figure }} for</dt><dd>{{ f.timeToThreshold === null ? 'the whole run' : (f.timeToThreshold | duration) }}</dd></div>
      <div class="stat"><dt>Largest error</dt><dd>{{ f.maxError | figure }}</dd></div>
      @for (e of f.errors; track e.coordinate) {
        <div class="stat"><dt>RMS error of {{ e.coordinate }}</dt><dd>{{ e.rms | figure }}</dd></div>
      }
      @if (f.energyDrift; as drift) {
        <div class="stat"><dt>Energy drift (relative)</dt><dd>{{ drift.relative | figure }}</dd></div>
      }
    </dl>
    <div class="plots">
      @for (plot of trajectoryPlots(); track plot.coordinate) {
        <figure>
          <figcaption>{{ plot.coordinate }}: simulated and recorded</figcaption>
          <app-line-chart [series]="plot.series" xLabel="time" [yLabel]="plot.coordinate" [height]="200" [ariaLabel]="'Simulated against recorded ' + plot.coordinate" />
        </figure>
      }
      <figure>
        <figcaption>Error over time (simulated − recorded)</figcaption>
        <app-line-chart [series]="errorSeries()" xLabel="time" yLabel="error" [height]="200" [marks]="thresholdMarks()" ariaLabel="Error of the simulation over time" />
      </figure>
    </div>
  `,
  styles: `
    .head { display: flex; flex-wrap: wrap; align-items: baseline; justify-content: space-between; gap: 8px; margin-bottom: 8px; }
    .name { margin: 0; font: var(--mat-sys-title-medium); }
    .role { margin-left: 6px; padding: 1px 8px; border-radius: 999px; background: var(--mat-sys-surface-container-high); font: var(--mat-sys-label-small); color: var(--mat-sys-on-surface-variant); vertical-align: 2px; }
    .status { display: inline-flex; align-items: center; gap: 4px; font: var(--mat-sys-label-large); color: #1f6b2a; }
    .status.bad { color: var(--mat-sys-error); }
    .status mat-icon { width: 18px; height: 18px; font-size: 18px; }
    .small { font: var(--mat-sys-body-small); }
    .plots { display: grid; grid-template-columns: repeat(auto-fill, minmax(420px, 1fr)); gap: 12px 20px; margin-top: 14px; }
    figure { margin: 0; min-width: 0; }
    figcaption { font: var(--mat-sys-title-small); margin-bottom: 4px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RecordingCheckView {
  readonly check = input.required<RecordingCheck>();

  protected readonly statusLabel = computed(() => statusLabels[this.check().figures.status]);
  protected readonly trajectoryPlots = computed(() => {
    const { trajectory } = this.check();
    return Object.keys(trajectory.recorded).map((coordinate, i) => ({
      coordinate,
      series: [
        { name: 'recorded', x: trajectory.time, y: trajectory.recorded[coordinate] ?? [], dashed: true, color: '#71787d' },
        { name: 'simulated', x: trajectory.time, y: trajectory.simulated[coordinate] ?? [], color: chartPalette[i % chartPalette.length] },
      ] satisfies ChartSeries[],
    }));
  });
  protected readonly errorSeries = computed((): ChartSeries[] => {
    const { trajectory } = this.check();
    return Object.entries(trajectory.error).map(([coordinate, values]) => ({ name: coordinate, x: trajectory.time, y: values }));
  });
  protected readonly thresholdMarks = computed(() => {
    const threshold = this.check().figures.threshold;
    return [
      { label: `+${threshold}`, y: threshold },
      { label: `−${threshold}`, y: -threshold },
    ];
  });
}
