import type { CoefficientNoiseReport, CoordinateNoise } from '../schemas/discovery-result.js';
import type { DerivativeSettings } from '../schemas/sweep-description.js';
import { largestShift } from './largest-shift.js';
import { formatNoiseShare } from './noise-share-format.js';
import { describeEstimator } from './recording-signals.js';

/**
 * From these a warning is given: the largest relative shift of the chosen model's coefficients under as much
 * noise again (coefficient-noise.ts), and the noise shares of its signals (signal-noise.ts). The shift tracks
 * the coefficient error itself, a little below it: on the double pendulum of test/unit/discovery/noise.test.ts
 * with 1e-4 to 3e-3 rad of position noise the error was 1.25 to 1.8 times the shift in the balance form and
 * 0.95 to 1.03 times in the derivative form (README, "What the warnings catch"). The shares catch what the
 * shift cannot: a wrong model whose few coefficients noise hardly moves, as when 14 % noise in the
 * accelerations made the derivative form choose th1 alone.
 */
export const COEFFICIENT_SHIFT_WARNING = 0.01;
export const VELOCITY_NOISE_WARNING = 0.01;
export const ACCELERATION_NOISE_WARNING = 0.02;

/** A warning when noise is large enough to bias the coefficients or to change the chosen terms, or null. */
export function signalNoiseWarning(
  noise: readonly CoordinateNoise[],
  coefficients: CoefficientNoiseReport | null,
  derivatives: DerivativeSettings,
): string | null {
  const noisy: { label: string; share: number }[] = [];
  for (const n of noise) {
    const position = `position noise ${n.positionNoise.toPrecision(2)}`;
    if (n.accelerationShare !== null && n.accelerationShare >= ACCELERATION_NOISE_WARNING) {
      noisy.push({ label: `accelerations of ${n.coordinate}: ${formatNoiseShare(n.accelerationShare)} noise (${position})`, share: n.accelerationShare });
    }
    if (n.velocityShare >= VELOCITY_NOISE_WARNING) {
      noisy.push({ label: `velocities of ${n.coordinate}: ${formatNoiseShare(n.velocityShare)} noise (${position})`, share: n.velocityShare });
    }
  }
  const largest = largestShift(coefficients);
  const shifted = largest !== null && largest.shift >= COEFFICIENT_SHIFT_WARNING;
  if (noisy.length === 0 && !shifted) return null;
  noisy.sort((a, b) => b.share - a.share);
  const accelerations = noisy.some((s) => s.label.startsWith('accelerations'));
  const parts = ['Noise:'];
  if (shifted) {
    parts.push(
      `adding as much noise again as the recordings carry moves the chosen model's coefficients by up to ` +
        `${formatNoiseShare(largest.shift)} (${largest.term}); expect errors of about that size, up to twice it, from the noise already in them.`,
    );
  }
  if (noisy.length > 0) {
    parts.push(
      `The signals the ${describeEstimator(derivatives)} made from the recordings are partly noise, estimated from the ` +
        `recordings themselves: ${noisy.map((s) => s.label).join('; ')}. Noise in the signals biases the coefficients ` +
        'and can change which terms win.',
    );
  }
  parts.push(
    accelerations
      ? 'The balance form needs no accelerations and tolerates far more noise: try it first; a wider window also helps.'
      : 'A wider Savitzky-Golay window, measured velocity columns or a finer position sensor lower it.',
  );
  return parts.join(' ');
}

