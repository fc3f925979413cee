import { integrate, outputState } from '../../../shared/math/integrator.js';
import { createNormalRandom, createSeededRandom } from '../../../shared/math/seeded-random.js';
import type { Mechanism } from './mechanism.js';

export { recordingToCsv, type CsvOptions } from './recording-to-csv.js';

export interface SimulationOptions {
  initial: { q: number[]; dq: number[] };
  /** Seconds; samples are taken at 0, sampleStep, 2 sampleStep, ... up to duration. */
  duration: number;
  sampleStep: number;
  /** Generalized forces per coordinate at time t (zero where a coordinate is not driven); passive when absent. */
  forces?: (t: number) => number[];
  /** Gaussian noise added to the sampled positions only (velocities and forces stay exact). */
  positionNoise?: { sigma: number; seed: number };
  /** Integrator tolerance, relative and absolute (default 1e-11). */
  rtol?: number;
}

export interface SimulatedRecording {
  time: Float64Array;
  /** Sampled positions per coordinate, with noise when asked for. */
  q: Float64Array[];
  /** The same positions without noise. */
  qExact: Float64Array[];
  /** Exact velocities per coordinate. */
  dq: Float64Array[];
  /** Generalized forces per coordinate (zeros on a passive run). */
  u: Float64Array[];
}

function checkOptions(mechanism: Mechanism, options: SimulationOptions): void {
  const n = mechanism.coordinates.length;
  if (options.initial.q.length !== n || options.initial.dq.length !== n) {
    throw new RangeError(`simulateRecording: ${mechanism.name} needs ${n} initial positions and velocities`);
  }
  if (!(options.duration > 0) || !(options.sampleStep > 0) || options.sampleStep > options.duration) {
    throw new RangeError('simulateRecording: duration and sampleStep must be positive, sampleStep not above duration');
  }
}

/**
 * Simulates the mechanism's hand-written equations of motion with the adaptive integrator at tight tolerance
 * and samples the motion uniformly (states come from the integrator's dense output).
 */
export function simulateRecording(mechanism: Mechanism, options: SimulationOptions): SimulatedRecording {
  checkOptions(mechanism, options);
  const n = mechanism.coordinates.length;
  const tolerance = options.rtol ?? 1e-11;
  const count = Math.floor(options.duration / options.sampleStep + 1e-9) + 1;
  const time = Float64Array.from({ length: count }, (_, k) => k * options.sampleStep);
  const zeros = new Array<number>(n).fill(0);
  const forces = options.forces ?? (() => zeros);

  const q = new Array<number>(n);
  const dq = new Array<number>(n);
  const result = integrate(
    (t, y, dydt) => {
      for (let i = 0; i < n; i++) {
        q[i] = y[i];
        dq[i] = y[n + i];
      }
      const ddq = mechanism.accelerations(q, dq, forces(t));
      for (let i = 0; i < n; i++) {
        dydt[i] = y[n + i];
        dydt[n + i] = ddq[i];
      }
    },
    0,
    [...options.initial.q, ...options.initial.dq],
    time[count - 1],
    { rtol: tolerance, atol: tolerance, outputTimes: time },
  );

  const columns = () => Array.from({ length: n }, () => new Float64Array(count));
  const recording: SimulatedRecording = { time, q: columns(), qExact: columns(), dq: columns(), u: columns() };
  for (let k = 0; k < count; k++) {
    const state = outputState(result, k);
    const u = forces(time[k]);
    for (let i = 0; i < n; i++) {
      recording.qExact[i][k] = state[i];
      recording.dq[i][k] = state[n + i];
      recording.u[i][k] = u[i];
    }
  }
  addPositionNoise(recording, options.positionNoise);
  return recording;
}

function addPositionNoise(recording: SimulatedRecording, noise: SimulationOptions['positionNoise']): void {
  const normal = noise ? createNormalRandom(createSeededRandom(noise.seed)) : null;
  recording.qExact.forEach((exact, i) => {
    const noisy = Float64Array.from(exact);
    if (normal && noise) for (let k = 0; k < noisy.length; k++) noisy[k] += noise.sigma * normal();
    recording.q[i] = noisy;
  });
}
