import type { SweepSettings } from '../schemas/sweep-description.js';
import type { CandidateTerm } from './candidate-term.js';
import { rootMeanSquare } from './form-rows.js';
import type { Recording } from './recording.js';
import { recordingSignals } from './recording-signals.js';
import { formRows } from './regression-system.js';
import type { TermSymbols } from './term-symbols.js';

/**
 * A model whose training residual is within this factor of its noise floor has reached it: adding terms
 * only fits noise (common practice, no source; the factor leaves room for the spread of the estimate).
 */
export const NOISE_FLOOR_FACTOR = 1.5;
/** Independent noise draws averaged for one floor estimate. */
const DRAWS = 3;
/** Normal quantile of 3/4, to turn a median absolute value into a standard deviation (A & S 26.2, from memory). */
const NORMAL_QUARTILE = 0.6744897501960817;
/** Weights of the sixth difference: binomial coefficients with alternating signs. */
const SIXTH_DIFFERENCE = [1, -6, 15, -20, 15, -6, 1];
/** Sum of their squares, C(12, 6) = 924: the variance gain of the sixth difference for independent noise. */
const SIXTH_DIFFERENCE_GAIN = 924;

/**
 * Standard deviation of white noise on a sampled signal, from its sixth differences: smooth motion cancels
 * in them up to h^6 times its sixth derivative, while independent noise of deviation s gives differences of
 * deviation s sqrt(924). The median makes the estimate robust to the few large differences of fast motion.
 * Assumes nearly uniform sampling; on clean, finely sampled data it returns a tiny upper bound.
 */
export function estimateWhiteNoise(values: Float64Array): number {
  const width = SIXTH_DIFFERENCE.length;
  if (values.length < width) return 0;
  const differences = new Float64Array(values.length - width + 1);
  for (let k = 0; k < differences.length; k++) {
    let sum = 0;
    for (let j = 0; j < width; j++) sum += SIXTH_DIFFERENCE[j]! * values[k + j]!;
    differences[k] = Math.abs(sum);
  }
  differences.sort();
  const middle = differences.length >> 1;
  const median = differences.length % 2 ? differences[middle]! : (differences[middle - 1]! + differences[middle]!) / 2;
  return median / NORMAL_QUARTILE / Math.sqrt(SIXTH_DIFFERENCE_GAIN);
}

export interface ModelUnderTest {
  /** Every term of the energy, the reference term included. */
  terms: readonly CandidateTerm[];
  coefficients: readonly number[];
}

/**
 * The root mean square residual a model would have from the noise in the recordings alone. The noise of every
 * measured channel (positions, measured velocities, forces) is estimated from the channel itself
 * (estimateWhiteNoise); fresh noise of that size is added to the recordings, the same signals and form rows
 * are rebuilt, and the change of the model's residual is measured. Because the recordings already carry
 * noise of that size, this change is what the existing noise contributes to the residual (a parametric
 * bootstrap with the model's coefficients held fixed).
 */
export function noiseFloorRmse(
  model: ModelUnderTest,
  recordings: readonly Recording[],
  settings: SweepSettings,
  symbols: TermSymbols,
  needAccelerations: boolean,
  normal: () => number,
): number {
  const baseline = modelResidual(model, recordings, settings, symbols, needAccelerations);
  const noise = recordings.map(channelNoise);
  let sum = 0;
  for (let draw = 0; draw < DRAWS; draw++) {
    const perturbed = recordings.map((r, i) => perturb(r, noise[i]!, normal));
    const residual = modelResidual(model, perturbed, settings, symbols, needAccelerations);
    for (let k = 0; k < residual.length; k++) residual[k] = residual[k]! - baseline[k]!;
    sum += rootMeanSquare(residual) ** 2;
  }
  return Math.sqrt(sum / DRAWS);
}

/** sum_j c_j a_j - P over the form's rows: the residual before the reference term moved to the right side. */
function modelResidual(
  model: ModelUnderTest,
  recordings: readonly Recording[],
  settings: SweepSettings,
  symbols: TermSymbols,
  needAccelerations: boolean,
): Float64Array {
  const signals = recordings.map((r) => recordingSignals(r, symbols, settings.derivatives, needAccelerations));
  const rows = formRows(settings, signals, model.terms);
  const residual = rows.power ? rows.power.map((p) => -p) : new Float64Array(rows.rowCount);
  rows.columns.forEach((column, j) => {
    for (let k = 0; k < residual.length; k++) residual[k] = residual[k]! + model.coefficients[j]! * column[k]!;
  });
  return residual;
}

/** Estimated white-noise deviation of every measured channel of one recording (null: channel absent). */
export interface ChannelNoise {
  positions: number[];
  velocities: (number | null)[];
  forces: (number | null)[] | null;
}

export function channelNoise(recording: Recording): ChannelNoise {
  const estimate = (v: Float64Array | null) => (v ? estimateWhiteNoise(v) : null);
  return {
    positions: recording.positions.map(estimateWhiteNoise),
    velocities: recording.velocities.map(estimate),
    forces: recording.forces ? recording.forces.map(estimate) : null,
  };
}

/** The recording with fresh noise of the given deviations added to every measured channel. */
export function perturb(recording: Recording, noise: ChannelNoise, normal: () => number): Recording {
  const add = (values: Float64Array, deviation: number) => values.map((v) => v + deviation * normal());
  const maybe = (values: Float64Array | null, deviation: number | null) =>
    values && deviation !== null ? add(values, deviation) : values;
  return {
    ...recording,
    positions: recording.positions.map((p, i) => add(p, noise.positions[i]!)),
    velocities: recording.velocities.map((v, i) => maybe(v, noise.velocities[i] ?? null)),
    forces: recording.forces ? recording.forces.map((f, i) => maybe(f, noise.forces?.[i] ?? null)) : null,
  };
}
