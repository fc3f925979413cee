import type { CoordinateNoise } from '../schemas/discovery-result.js';
import type { DerivativeSettings } from '../schemas/sweep-description.js';
import { channelNoise, perturb } from './noise-floor.js';
import type { Recording } from './recording.js';
import { recordingSignals, type RecordingSignals } from './recording-signals.js';
import type { TermSymbols } from './term-symbols.js';

/**
 * How much of each estimated velocity and acceleration is noise. The positions' noise is estimated from the
 * recordings themselves (estimateWhiteNoise); fresh noise of that size is added, the signals are estimated
 * again, and the change is compared with the signals: the estimators are linear, so the change is exactly
 * what noise of that size does to them. A share is the rms of that change over the rms of the signal as
 * estimated (noise included), over every sample of the recordings given: near 1 when a signal is all noise.
 */
export function measureSignalNoise(
  recordings: readonly Recording[],
  /** The signals already estimated from those recordings, in the same order and with the same settings. */
  estimated: readonly RecordingSignals[],
  symbols: TermSymbols,
  derivatives: DerivativeSettings,
  needAccelerations: boolean,
  normal: () => number,
): CoordinateNoise[] {
  const sums = symbols.coordinates.map(() => ({ velocity: 0, velocityNoise: 0, acceleration: 0, accelerationNoise: 0 }));
  const positionNoise = symbols.coordinates.map(() => 0);
  recordings.forEach((recording, r) => {
    const noise = channelNoise(recording);
    const clean = estimated[r]!;
    const noisy = recordingSignals(perturb(recording, noise, normal), symbols, derivatives, needAccelerations);
    symbols.coordinates.forEach((_, i) => {
      const sum = sums[i]!;
      positionNoise[i] = positionNoise[i]! + noise.positions[i]! ** 2;
      const velocity = addSquares(clean.samples.column(symbols.velocities[i]!), noisy.samples.column(symbols.velocities[i]!));
      sum.velocity += velocity.signal;
      sum.velocityNoise += velocity.change;
      if (!needAccelerations) return;
      const acceleration = addSquares(
        clean.samples.column(symbols.accelerations[i]!),
        noisy.samples.column(symbols.accelerations[i]!),
      );
      sum.acceleration += acceleration.signal;
      sum.accelerationNoise += acceleration.change;
    });
  });
  const recordingCount = recordings.length;
  return symbols.coordinates.map((coordinate, i) => {
    const sum = sums[i]!;
    return {
      coordinate,
      positionNoise: Math.sqrt(positionNoise[i]! / Math.max(1, recordingCount)),
      velocityShare: share(sum.velocityNoise, sum.velocity),
      accelerationShare: needAccelerations ? share(sum.accelerationNoise, sum.acceleration) : null,
    };
  });
}

function addSquares(clean: Float64Array, noisy: Float64Array): { signal: number; change: number } {
  let signal = 0;
  let change = 0;
  for (let k = 0; k < clean.length; k++) {
    signal += clean[k]! ** 2;
    change += (noisy[k]! - clean[k]!) ** 2;
  }
  return { signal, change };
}

function share(noiseSquares: number, signalSquares: number): number {
  return signalSquares > 0 ? Math.sqrt(noiseSquares / signalSquares) : 0;
}
