import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { CoordinateNoise } from '../../../../../shared/schemas/discovery-result';
import { formatNoiseShare } from '../../../../../shared/math/noise-share-format';
import { FigurePipe } from '../../shared/format/figure-pipe';

/**
 * How noisy the signals of a sweep were, per coordinate: the noise on the recorded positions and the share of
 * noise in the velocities and accelerations made from them. Noise biases the coefficients, so it is shown
 * beside the models rather than left for the engineer to guess.
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
  `,
  styles: `
    .noise { border-collapse: collapse; margin-top: 12px; font: var(--mat-sys-body-small); }
    caption { text-align: left; padding-bottom: 4px; }
    th, td { padding: 4px 12px 4px 0; text-align: left; }
    .numeric { text-align: right; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignalNoiseTable {
  readonly noise = input.required<readonly CoordinateNoise[]>();

  protected readonly percent = formatNoiseShare;
}
