import type { CoordinateNoise } from '../schemas/discovery-result.js';
import type { DerivativeSettings } from '../schemas/sweep-description.js';
import { formatNoiseShare } from './noise-share-format.js';
import { describeEstimator } from './recording-signals.js';

/**
 * Noise shares from which a warning is given. Noise in the estimated signals enters the regression columns
 * (errors in variables) and biases the coefficients by several times its share: on the double pendulum of
 * test/unit/discovery/noise.test.ts, 1 % noise in the velocities gave 3 % coefficient error in the balance
 * form and 3 % gave 15 %; 6 % noise in the accelerations gave 24 % in the derivative form and 14 % chose the
 * wrong terms (README, "Noise").
 */
export const VELOCITY_NOISE_WARNING = 0.01;
export const ACCELERATION_NOISE_WARNING = 0.02;

/** A warning naming the signals whose noise share is large enough to bias the coefficients, or null. */
export function signalNoiseWarning(noise: readonly CoordinateNoise[], derivatives: DerivativeSettings): string | null {
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
  if (noisy.length === 0) return null;
  noisy.sort((a, b) => b.share - a.share);
  const accelerations = noisy.some((s) => s.label.startsWith('accelerations'));
  return (
    `Noise: the signals the ${describeEstimator(derivatives)} made from the recordings are partly noise, estimated ` +
    `from the recordings themselves: ${noisy.map((s) => s.label).join('; ')}. Noise in the signals biases the ` +
    'coefficients by several times its share and can change which terms win. ' +
    (accelerations
      ? 'The balance form needs no accelerations and tolerates far more noise: try it first; a wider window also helps.'
      : 'A wider Savitzky-Golay window, measured velocity columns or a finer position sensor lower it.')
  );
}

