import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { CoefficientNoiseReport, CoordinateNoise } from '../../../../../shared/schemas/discovery-result';
import { largestShift } from '../../../../../shared/math/largest-shift';
import { formatNoiseShare } from '../../../../../shared/math/noise-share-format';
import { FigurePipe } from '../../shared/format/figure-pipe';

/**
 * How noisy the signals of a sweep were, per coordinate: the noise on the recorded positions and the share of
 * noise in the velocities and accelerations made from them, and how far that noise moves the best model's
 * coefficients. Noise biases the coefficients, so it is shown beside the models rather than left to guess.
 */
@Component({
  selector: 'app-signal-noise-table',
  imports: [FigurePipe],
  template: `
    <table class="noise" aria-label="Noise in the signals" data-test="signal-noise">
      <caption class="muted">Noise in the training signals, estimated from the recordings</caption>
      <thead>
        <tr>
          <th scope="col">Coordinate</th>
          <th scope="col" class="numeric">Position noise</th>
          <th scope="col" class="numeric">Noise in velocities</th>
          <th scope="col" class="numeric">Noise in accelerations</th>
        </tr>
      </thead>
      <tbody>
        @for (n of noise(); track n.coordinate) {
          <tr>
            <th scope="row"><code>{{ n.coordinate }}</code></th>
            <td class="numeric">{{ n.positionNoise | figure: 2 }}</td>
            <td class="numeric">{{ percent(n.velocityShare) }}</td>
            <td class="numeric">{{ n.accelerationShare === null ? 'not used' : percent(n.accelerationShare) }}</td>
          </tr>
        }
      </tbody>
    </table>
    @if (largestShift(); as largest) {
      <p class="muted shift" data-test="coefficient-noise">
        Adding as much noise again moves the best model's coefficients by up to {{ percent(largest.shift) }}
        (<code>{{ largest.term }}</code>): expect errors of about that size, up to twice it, from the noise in the recordings.
      </p>
    }
  `,
  styles: `
    .noise { border-collapse: collapse; margin-top: 12px; font: var(--mat-sys-body-small); }
    caption { text-align: left; padding-bottom: 4px; }
    th, td { padding: 4px 12px 4px 0; text-align: left; }
    .numeric { text-align: right; }
    .shift { margin: 6px 0 0; font: var(--mat-sys-body-small); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignalNoiseTable {
  readonly noise = input.required<readonly CoordinateNoise[]>();
  /** The best model's coefficients under more noise, when the sweep measured it. */
  readonly coefficients = input<CoefficientNoiseReport | null | undefined>(null);

  protected readonly largestShift = computed(() => largestShift(this.coefficients()));

  protected readonly percent = formatNoiseShare;
}
