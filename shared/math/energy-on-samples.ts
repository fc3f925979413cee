import type { CandidateTerm } from './candidate-term.js';
import { concatenate } from './form-rows.js';
import type { RecordingSignals } from './recording-signals.js';

/** sum_j c_j theta_j evaluated on every sample of the recordings, concatenated in order. */
export function energyOnSamples(
  terms: readonly CandidateTerm[],
  coefficients: readonly number[],
  signals: readonly RecordingSignals[],
): Float64Array {
  const energy = new Float64Array(signals.reduce((sum, s) => sum + s.length, 0));
  terms.forEach((term, j) => {
    const values = concatenate(signals.map((s) => term.value(s.samples)));
    for (let i = 0; i < energy.length; i++) energy[i] = energy[i]! + coefficients[j]! * values[i]!;
  });
  return energy;
}

/**
 * rms of (a - b) with their means removed, relative to the rms of a with its mean removed: how much two
 * energies differ as functions on the samples, free of the additive constant no data can fix.
 */
export function relativeEnergyDifference(a: Float64Array, b: Float64Array): number {
  const n = a.length;
  let meanA = 0;
  let meanB = 0;
  for (let i = 0; i < n; i++) {
    meanA += a[i]! / n;
    meanB += b[i]! / n;
  }
  let diff = 0;
  let size = 0;
  for (let i = 0; i < n; i++) {
    diff += (a[i]! - meanA - b[i]! + meanB) ** 2;
    size += (a[i]! - meanA) ** 2;
  }
  return size > 0 ? Math.sqrt(diff / size) : diff > 0 ? Infinity : 0;
}
