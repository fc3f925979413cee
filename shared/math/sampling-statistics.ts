import { DiscoveryInputError } from './discovery-input-error.js';

/**
 * How recordings were sampled: the spread of time steps within each recording (never across the seam between
 * two recordings), the sample rate they imply, and whether the sampling is uniform enough for estimators that
 * assume one fixed step.
 */

/** Largest relative deviation of a time step from the mean step that still counts as uniform sampling. */
export const UNIFORM_STEP_TOLERANCE = 1e-3;

export interface StepSummary {
  min: number;
  median: number;
  max: number;
}

export interface SamplingStatistics {
  recordingCount: number;
  sampleCount: number;
  /** Time steps of all recordings together (each step within one recording); null without any step. */
  steps: StepSummary | null;
  /** Samples per second from the median step; null without any step. */
  sampleRate: number | null;
  /** Every step of every recording within UNIFORM_STEP_TOLERANCE of its own recording's mean step. */
  uniform: boolean;
  /** Steps longer than 1.5 times the median step: dropped samples or pauses in a log. */
  gapCount: number;
  perRecording: { sampleCount: number; steps: StepSummary | null; uniform: boolean }[];
}

function summarize(steps: Float64Array): StepSummary | null {
  if (steps.length === 0) return null;
  const sorted = Float64Array.from(steps).sort();
  const middle = sorted.length >> 1;
  const median = sorted.length % 2 === 1 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
  return { min: sorted[0], median, max: sorted[sorted.length - 1] };
}

function stepsOf(time: ArrayLike<number>): Float64Array {
  const steps = new Float64Array(Math.max(0, time.length - 1));
  for (let k = 1; k < time.length; k++) steps[k - 1] = time[k] - time[k - 1];
  return steps;
}

/**
 * Where the sampling of one recording departs from a uniform step, or null when every step is within
 * UNIFORM_STEP_TOLERANCE of the mean step (t_last - t_first) / (n - 1).
 */
export function nonUniformStep(time: ArrayLike<number>): { index: number; step: number; meanStep: number } | null {
  const n = time.length;
  if (n < 2) return null;
  const meanStep = (time[n - 1] - time[0]) / (n - 1);
  let worst: { index: number; step: number; deviation: number } | null = null;
  for (let k = 1; k < n; k++) {
    const step = time[k] - time[k - 1];
    const deviation = Math.abs(step - meanStep);
    if (!(deviation <= UNIFORM_STEP_TOLERANCE * Math.abs(meanStep)) && (!worst || !(deviation <= worst.deviation))) {
      worst = { index: k, step, deviation };
    }
  }
  return worst ? { index: worst.index, step: worst.step, meanStep } : null;
}

/** Sample rate and step statistics of several recordings, each one's steps taken within it only. */
export function samplingStatistics(times: readonly ArrayLike<number>[]): SamplingStatistics {
  const perStepArrays = times.map(stepsOf);
  const all = new Float64Array(perStepArrays.reduce((sum, s) => sum + s.length, 0));
  let offset = 0;
  for (const steps of perStepArrays) {
    all.set(steps, offset);
    offset += steps.length;
  }
  const steps = summarize(all);
  const perRecording = times.map((time, i) => ({
    sampleCount: time.length,
    steps: summarize(perStepArrays[i]),
    uniform: nonUniformStep(time) === null,
  }));
  const gapLimit = steps ? 1.5 * steps.median : Infinity;
  return {
    recordingCount: times.length,
    sampleCount: times.reduce((sum, time) => sum + time.length, 0),
    steps,
    sampleRate: steps && steps.median > 0 ? 1 / steps.median : null,
    uniform: perRecording.every((r) => r.uniform),
    gapCount: all.reduce((count, step) => count + (step > gapLimit ? 1 : 0), 0),
    perRecording,
  };
}

/** Refuses a time column that is not finite and strictly increasing, naming the first sample at fault. */
export function assertIncreasingTime(time: ArrayLike<number>): void {
  for (let k = 0; k < time.length; k++) {
    if (!Number.isFinite(time[k])) throw new DiscoveryInputError(`Time at sample ${k} is not a finite number (${time[k]}).`);
    if (k > 0 && !(time[k] > time[k - 1])) {
      throw new DiscoveryInputError(
        `Time must increase from sample to sample; sample ${k} (t = ${time[k]}) does not come after sample ${k - 1} (t = ${time[k - 1]}).`);
    }
  }
}
