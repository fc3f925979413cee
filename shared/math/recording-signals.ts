import type { DerivativeSettings } from '../schemas/sweep-description.js';
import { derivativeTrim, estimateDerivatives } from './derivative-estimators.js';
import { DiscoveryInputError } from './discovery-input-error.js';
import type { Recording } from './recording.js';
import { sampleColumns, type SampleColumns } from './term-compiler.js';
import type { TermSymbols } from './term-symbols.js';

/**
 * The signals of one recording on the samples where every estimate is valid (edges trimmed, never
 * extrapolated): positions, velocities, accelerations when asked for, and the input power sum_i u_i dq_i.
 */
export interface RecordingSignals {
  name: string;
  role: Recording['role'];
  time: Float64Array;
  /** Every symbol's column (`x`, `dx`, and `ddx` when accelerations were estimated) for compiled terms. */
  samples: SampleColumns;
  /** sum_i u_i dq_i on the samples, or null for passive data. */
  power: Float64Array | null;
  length: number;
}

/**
 * Estimates what the regression needs from one recording, on that recording alone (so no estimate ever
 * straddles the seam between two recordings):
 * - velocities: the measured column when the description maps one, else the estimator's derivative of the
 *   position;
 * - accelerations (only when `needAccelerations`): the estimator's derivative of the measured velocity when
 *   there is one (one differentiation instead of two), else its second derivative of the position;
 * - positions: the estimator's position output (smoothed by Savitzky-Golay, unchanged by central
 *   differences) for coordinates whose derivatives it estimated, the raw column otherwise.
 * The result covers the samples where every estimate used is valid.
 */
export function recordingSignals(
  recording: Recording,
  symbols: TermSymbols,
  settings: DerivativeSettings,
  needAccelerations: boolean,
): RecordingSignals {
  const count = recording.time.length;
  const estimatorNeeded = needAccelerations || recording.velocities.some((v) => v === null);
  const trim = estimatorNeeded ? derivativeTrim(settings) : 0;
  if (count - 2 * trim < 2) {
    throw new DiscoveryInputError(
      `${recording.name} has ${count} samples; the ${describeEstimator(settings)} trims ${trim} at each end, ` +
        `which leaves fewer than the 2 samples a regression needs.`,
    );
  }

  let start = 0;
  let end = count;
  const estimate = (signal: Float64Array) => {
    const result = estimateOrExplain(recording, signal, settings);
    start = Math.max(start, result.start);
    end = Math.min(end, result.end);
    return result;
  };

  const full: Record<string, Float64Array> = {};
  symbols.coordinates.forEach((coordinate, i) => {
    const position = recording.positions[i]!;
    const measured = recording.velocities[i] ?? null;
    const velocityName = symbols.velocities[i]!;
    const accelerationName = symbols.accelerations[i]!;
    if (measured) {
      full[coordinate] = position;
      full[velocityName] = measured;
      if (needAccelerations) full[accelerationName] = estimate(measured).velocity;
    } else {
      const estimated = estimate(position);
      full[coordinate] = estimated.position;
      full[velocityName] = estimated.velocity;
      if (needAccelerations) full[accelerationName] = estimated.acceleration;
    }
  });

  const length = end - start;
  const trimmed: Record<string, Float64Array> = {};
  for (const [name, column] of Object.entries(full)) trimmed[name] = column.slice(start, end);
  return {
    name: recording.name,
    role: recording.role,
    time: recording.time.slice(start, end),
    samples: sampleColumns(trimmed, length),
    power: inputPower(recording, symbols, trimmed, start, end),
    length,
  };
}

/** The estimator's refusals (uneven sampling, too short) do not know the recording: name it. */
function estimateOrExplain(recording: Recording, signal: Float64Array, settings: DerivativeSettings) {
  try {
    return estimateDerivatives(recording.time, signal, settings);
  } catch (error) {
    if (error instanceof DiscoveryInputError) throw new DiscoveryInputError(`${recording.name}: ${error.message}`);
    throw error;
  }
}

function inputPower(
  recording: Recording,
  symbols: TermSymbols,
  trimmed: Record<string, Float64Array>,
  start: number,
  end: number,
): Float64Array | null {
  if (!recording.forces || recording.forces.every((f) => f === null)) return null;
  const power = new Float64Array(end - start);
  recording.forces.forEach((force, i) => {
    if (!force) return;
    const velocity = trimmed[symbols.velocities[i]!]!;
    for (let k = 0; k < power.length; k++) power[k] = power[k]! + force[start + k]! * velocity[k]!;
  });
  return power;
}

/** Words for the estimator and its parameters, as every sweep reports them. */
export function describeEstimator(settings: DerivativeSettings): string {
  return settings.method === 'central'
    ? 'central-difference estimator'
    : `Savitzky-Golay estimator (window ${settings.window}, order ${settings.order})`;
}
