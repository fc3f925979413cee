import type { ModelValidation, TrajectoryComparison } from '../schemas/model-validation.js';
import type { ModelEnergy } from './model-energy.js';
import { isPassive, type ModelSimulation } from './model-simulation.js';
import type { Recording } from './recording.js';
import { thinnedIndices } from './thinned-indices.js';

export interface ValidationOptions {
  /** Error in coordinate units after which the model counts as having left the recording (every coordinate). */
  threshold: number;
}

/**
 * Compares a model's simulation (model-simulation.ts) with the recording it was driven by: per coordinate the
 * RMS and largest error of simulated minus recorded position over the simulated samples, the time from the
 * start until some coordinate's error first exceeds the threshold, and on passive recordings the drift of the
 * model's energy along the simulated motion (a conservative model conserves it; drift shows integration error
 * or an energy that does not belong to the equations). Positions are compared with the recorded values as
 * they are in the file, not smoothed.
 */
export function validateSimulation(
  recording: Recording,
  coordinates: readonly string[],
  simulation: ModelSimulation,
  energy: ModelEnergy,
  options: ValidationOptions,
): ModelValidation {
  const count = simulation.time.length;
  const errorSeries = trajectoryErrors(recording, simulation);
  const errors = coordinates.map((coordinate, i) => {
    const e = errorSeries[i]!;
    let squares = 0;
    let max = 0;
    for (let k = 0; k < count; k++) {
      squares += e[k]! * e[k]!;
      max = Math.max(max, Math.abs(e[k]!));
    }
    return { coordinate, rms: count > 0 ? Math.sqrt(squares / count) : 0, max };
  });
  const start = recording.time[simulation.start]!;
  const passive = isPassive(recording);
  return {
    recording: recording.name,
    role: recording.role,
    passive,
    status: simulation.status,
    message: simulation.message,
    start,
    end: count > 0 ? simulation.time[count - 1]! : start,
    recordedEnd: recording.time[recording.time.length - 1]!,
    samples: count,
    errors,
    maxError: Math.max(0, ...errors.map((e) => e.max)),
    threshold: options.threshold,
    timeToThreshold: timeToThreshold(errorSeries, simulation.time, options.threshold, start),
    energyDrift: passive && count > 0 ? energyDrift(simulation, energy) : null,
  };
}

/** Simulated minus recorded position per coordinate at every simulated sample. */
export function trajectoryErrors(recording: Recording, simulation: ModelSimulation): Float64Array[] {
  return simulation.q.map((simulated, i) => {
    const recorded = recording.positions[i]!;
    return simulated.map((value, k) => value - recorded[simulation.start + k]!);
  });
}

function timeToThreshold(errors: Float64Array[], time: Float64Array, threshold: number, start: number): number | null {
  for (let k = 0; k < time.length; k++) {
    for (const e of errors) if (!(Math.abs(e[k]!) <= threshold)) return time[k]! - start;
  }
  return null;
}

function energyDrift(simulation: ModelSimulation, energy: ModelEnergy): ModelValidation['energyDrift'] {
  const n = simulation.q.length;
  const q = new Float64Array(n);
  const dq = new Float64Array(n);
  const at = { value: 0, scale: 0 };
  let initial = 0;
  let absolute = 0;
  let scale = 0;
  for (let k = 0; k < simulation.time.length; k++) {
    for (let i = 0; i < n; i++) {
      q[i] = simulation.q[i]![k]!;
      dq[i] = simulation.dq[i]![k]!;
    }
    energy(q, dq, at);
    if (k === 0) initial = at.value;
    absolute = Math.max(absolute, Math.abs(at.value - initial));
    scale = Math.max(scale, at.scale);
  }
  return { absolute, relative: scale > 0 ? absolute / scale : 0, scale };
}

/**
 * Simulated and recorded positions and their difference for plots and output, thinned to at most `maxPoints`
 * samples (thinnedIndices: every k-th sample, the last one always kept).
 */
export function trajectoryComparison(
  recording: Recording,
  coordinates: readonly string[],
  simulation: ModelSimulation,
  maxPoints: number,
): TrajectoryComparison {
  const picked = thinnedIndices(simulation.time.length, maxPoints).indices;
  const errors = trajectoryErrors(recording, simulation);
  const byCoordinate = (series: (i: number) => ArrayLike<number>) =>
    Object.fromEntries(coordinates.map((c, i) => [c, picked.map((k) => series(i)[k]!)]));
  return {
    time: picked.map((k) => simulation.time[k]!),
    simulated: byCoordinate((i) => simulation.q[i]!),
    recorded: byCoordinate((i) => recording.positions[i]!.subarray(simulation.start)),
    error: byCoordinate((i) => errors[i]!),
  };
}
