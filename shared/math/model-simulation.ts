import { integrate, IntegrationError, type IntegrationResult } from './integrator.js';
import type { ModelDynamics } from './model-dynamics.js';
import type { Recording } from './recording.js';
import type { RecordingStates } from './recording-states.js';
import type { ForceInterpolation } from '../schemas/model-validation.js';

/**
 * A failed run whose last attempted steps met a mass matrix with a pivot this small against the largest entry
 * of the mass matrix at the initial state ran into a singular mass matrix (common practice, no source: far
 * below any physical conditioning, far above rounding).
 */
const NEAR_SINGULAR_PIVOT = 1e-6;

export type SimulationStatus = 'finished' | 'singular-mass-matrix' | 'diverged' | 'too-many-steps';

export type { ForceInterpolation };

export interface SimulationOptions {
  /**
   * How recorded forces are read between samples: `cubic` (default; Hermite with centred-difference slopes, for
   * smooth forces: no bias of order dt^2 as with straight lines, which on our simulated double pendulum at 100
   * samples/s made a 1e-4 rad error where cubic made 1e-7), `linear`, or `hold` (each sample held until the
   * next, as a digital controller that updates its output once per sample applies it).
   */
  forceInterpolation?: ForceInterpolation;
  /** Integrator tolerance, relative (default 1e-9) and absolute (default 1e-11). */
  rtol?: number;
  atol?: number;
  /** Attempted steps allowed (default 1e6). */
  maxSteps?: number;
}

/** A model driven through a recording: its states at the recording's sample times from the start onwards. */
export interface ModelSimulation {
  status: SimulationStatus;
  /** Why the run ended early, in words; null when it finished. */
  message: string | null;
  /** Index in the recording of the first simulated sample (the initial state). */
  start: number;
  /** Sample times reached, from the start. */
  time: Float64Array;
  /** Simulated positions and velocities per coordinate at those times. */
  q: Float64Array[];
  dq: Float64Array[];
  /** Time of the last accepted state when the run ended early, else null. */
  stoppedAt: number | null;
  evaluations: number;
}

/**
 * Simulates a model's equations of motion over a recording: from the recording's state at its first valid
 * sample (`states`, whose velocities may be estimated), driven by the recording's generalized forces read
 * between samples as `forceInterpolation` says (zero on coordinates without forces, and for passive
 * recordings), with the adaptive Dormand-Prince integrator (integrator.ts), its steps no longer than the
 * sampling interval so that no change of the forces is stepped over. States at the sample times come from the dense output.
 * Where the mass matrix turns singular the run stops and reports the time reached; so it does when the motion
 * stops being finite or needs too many steps. Pure: the recording is not changed.
 */
export function simulateModel(
  dynamics: ModelDynamics,
  recording: Recording,
  states: RecordingStates,
  options: SimulationOptions = {},
): ModelSimulation {
  const n = dynamics.n;
  const start = states.start;
  const outputTimes = recording.time.subarray(start);
  if (outputTimes.length < 2) {
    throw new RangeError(`simulateModel: ${recording.name} has fewer than two samples after its first valid state`);
  }
  const t0 = outputTimes[0]!;
  const tEnd = outputTimes[outputTimes.length - 1]!;
  const initial = [...states.q.map((q) => q[0]!), ...states.dq.map((dq) => dq[0]!)];
  const force = forceInterpolation(recording, n, options.forceInterpolation ?? 'cubic');
  let singularAt: number | null = null;
  // Smallest pivot over the evaluations since the last accepted step: tells a run that failed because its mass
  // matrix approached singular from one that failed for another reason.
  let smallestPivotSinceAccepted = Infinity;
  const initialScale = largestEntry(dynamics, initial);
  const q = new Float64Array(n);
  const dq = new Float64Array(n);
  const ddq = new Float64Array(n);
  const u = new Float64Array(n);
  const rightSide = (t: number, y: Float64Array, dydt: Float64Array) => {
    for (let i = 0; i < n; i++) {
      q[i] = y[i]!;
      dq[i] = y[n + i]!;
    }
    force(t, u);
    const pivot = dynamics.accelerations(q, dq, u, ddq);
    const solved = pivot > 0;
    if (!solved && singularAt === null) singularAt = t;
    smallestPivotSinceAccepted = Math.min(smallestPivotSinceAccepted, pivot);
    for (let i = 0; i < n; i++) {
      dydt[i] = y[n + i]!;
      dydt[n + i] = solved ? ddq[i]! : NaN;
    }
  };
  const integrateTo = (end: number, times: Float64Array) =>
    integrate(rightSide, t0, initial, end, {
      rtol: options.rtol ?? 1e-9,
      atol: options.atol ?? 1e-11,
      maxStep: samplingInterval(outputTimes),
      maxSteps: options.maxSteps ?? 1_000_000,
      outputTimes: times,
      shouldStop: () => {
        smallestPivotSinceAccepted = Infinity;
        return false;
      },
    });

  try {
    return { ...outputsOf(integrateTo(tEnd, outputTimes), start, outputTimes, n), status: 'finished', message: null, stoppedAt: null };
  } catch (error) {
    if (!(error instanceof IntegrationError)) throw error;
    const nearSingular = singularAt !== null || !(smallestPivotSinceAccepted > NEAR_SINGULAR_PIVOT * initialScale);
    const status: SimulationStatus =
      error.reason === 'too-many-steps' ? 'too-many-steps' : nearSingular ? 'singular-mass-matrix' : 'diverged';
    const at = Number(error.t.toPrecision(6));
    const message =
      status === 'singular-mass-matrix'
        ? `the mass matrix of the model turns singular near t = ${at}: the simulation stopped there`
        : status === 'too-many-steps'
          ? `the simulation needed more than the allowed steps and stopped at t = ${at}`
          : `the simulated motion stopped being finite near t = ${at}`;
    return { ...rerunUpTo(error.t), status, message, stoppedAt: error.t };
  }

  /** The run up to the time reached: the same steps again, ending there, so the outputs before it are served. */
  function rerunUpTo(reached: number): SimulatedPart {
    let count = 0;
    while (count < outputTimes.length && outputTimes[count]! <= reached) count++;
    if (count === 0 || reached <= t0) return empty(start, n);
    const times = outputTimes.subarray(0, count);
    try {
      return outputsOf(integrateTo(reached, times), start, times, n);
    } catch (error) {
      if (!(error instanceof IntegrationError)) throw error;
      // Ending exactly at the time reached can still fail there: end at the sample before it instead.
      return rerunUpTo(error.t < reached ? error.t : count >= 2 ? times[count - 2]! : t0);
    }
  }
}

type SimulatedPart = Omit<ModelSimulation, 'status' | 'message' | 'stoppedAt'>;

/** The states at the output times an integration reached. */
function outputsOf(result: IntegrationResult, start: number, times: Float64Array, n: number): SimulatedPart {
  const count = result.outputCount;
  const q = Array.from({ length: n }, () => new Float64Array(count));
  const dq = Array.from({ length: n }, () => new Float64Array(count));
  for (let k = 0; k < count; k++) {
    for (let i = 0; i < n; i++) {
      q[i]![k] = result.outputs[k * 2 * n + i]!;
      dq[i]![k] = result.outputs[k * 2 * n + n + i]!;
    }
  }
  return { start, time: times.slice(0, count), q, dq, evaluations: result.statistics.evaluations };
}

function empty(start: number, n: number): SimulatedPart {
  return {
    start,
    time: new Float64Array(0),
    q: Array.from({ length: n }, () => new Float64Array(0)),
    dq: Array.from({ length: n }, () => new Float64Array(0)),
    evaluations: 0,
  };
}

/** The largest entry of the mass matrix at a state given as [q, dq]. */
function largestEntry(dynamics: ModelDynamics, state: number[]): number {
  const n = dynamics.n;
  const matrix = new Float64Array(n * n);
  dynamics.massMatrix(state.slice(0, n), state.slice(n), matrix);
  return matrix.reduce((largest, entry) => Math.max(largest, Math.abs(entry)), 0);
}

/** The smallest interval between samples: the largest step that cannot skip a sample of the forces. */
function samplingInterval(time: Float64Array): number {
  let smallest = Infinity;
  for (let k = 1; k < time.length; k++) smallest = Math.min(smallest, time[k]! - time[k - 1]!);
  return smallest;
}

/**
 * u(t) between the recorded samples (held at the ends). A cursor remembers the last interval, since the
 * integrator asks for nearby times in nearly increasing order; nothing is allocated per call.
 */
function forceInterpolation(recording: Recording, n: number, mode: ForceInterpolation): (t: number, out: Float64Array) => void {
  const forces = recording.forces;
  if (!forces || forces.every((f) => f === null)) return (_t, out) => out.fill(0);
  const time = recording.time;
  const last = time.length - 1;
  const slopes = mode === 'cubic' ? forces.map((f) => (f ? centredSlopes(time, f) : null)) : null;
  let cursor = 0;
  return (t, out) => {
    while (cursor > 0 && time[cursor]! > t) cursor--;
    while (cursor < last - 1 && time[cursor + 1]! <= t) cursor++;
    const t0 = time[cursor]!;
    const h = time[cursor + 1]! - t0;
    const s = Math.min(1, Math.max(0, (t - t0) / h));
    for (let i = 0; i < n; i++) {
      const f = forces[i];
      if (!f) out[i] = 0;
      else if (mode === 'hold') out[i] = s < 1 ? f[cursor]! : f[cursor + 1]!;
      else if (mode === 'linear') out[i] = f[cursor]! + s * (f[cursor + 1]! - f[cursor]!);
      else {
        // Cubic Hermite basis on [t0, t0 + h].
        const m = slopes![i]!;
        const s2 = s * s;
        const s3 = s2 * s;
        out[i] =
          (2 * s3 - 3 * s2 + 1) * f[cursor]! + (s3 - 2 * s2 + s) * h * m[cursor]! +
          (-2 * s3 + 3 * s2) * f[cursor + 1]! + (s3 - s2) * h * m[cursor + 1]!;
      }
    }
  };
}

/** Slopes for cubic Hermite interpolation: centred differences inside, one-sided at the two ends. */
function centredSlopes(time: Float64Array, f: Float64Array): Float64Array {
  const last = time.length - 1;
  const slopes = new Float64Array(time.length);
  for (let k = 0; k <= last; k++) {
    const a = Math.max(0, k - 1);
    const b = Math.min(last, k + 1);
    slopes[k] = (f[b]! - f[a]!) / (time[b]! - time[a]!);
  }
  return slopes;
}

/** True when a recording carries no generalized force, or only zeros. */
export function isPassive(recording: Recording): boolean {
  return !recording.forces || recording.forces.every((f) => f === null || f.every((v) => v === 0));
}
