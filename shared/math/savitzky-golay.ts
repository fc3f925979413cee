import savitzkyGolayImport from 'ml-savitzky-golay';
import type { DerivativeEstimate } from './derivative-estimators.js';
import { DiscoveryInputError } from './discovery-input-error.js';
import { assertIncreasingTime, nonUniformStep, UNIFORM_STEP_TOLERANCE } from './sampling-statistics.js';

type Filter = (data: number[], h: number, options: { windowSize: number; derivative: number; polynomial: number; pad: 'none' }) => number[];
// The package is CommonJS: Node hands an ES module its exports object (filter on `default`), while bundlers
// hand over the default export itself.
const imported = savitzkyGolayImport as unknown as Filter | { default: Filter };
const savitzkyGolayFilter: Filter = typeof imported === 'function' ? imported : imported.default;

/**
 * Checks a Savitzky-Golay window and polynomial order: an odd window of at least order + 2 samples (so the fit
 * smooths rather than interpolates), and order 2 or more (accelerations need the quadratic coefficient).
 */
export function checkSavitzkyGolaySettings(window: number, order: number): void {
  if (!Number.isInteger(order) || order < 2) {
    throw new DiscoveryInputError(
      `The Savitzky-Golay polynomial order must be a whole number of at least 2 (accelerations need it); got ${order}.`);
  }
  if (!Number.isInteger(window) || window % 2 === 0) {
    throw new DiscoveryInputError(`The Savitzky-Golay window must be an odd whole number of samples; got ${window}.`);
  }
  if (window < order + 2) {
    const smallest = order % 2 === 0 ? order + 3 : order + 2;
    throw new DiscoveryInputError(
      `The Savitzky-Golay window of ${window} samples is too short for order ${order}: it needs at least ` +
        `order + 2 samples, so an odd window of ${smallest} or more.`);
  }
}

function uniformStepOf(time: Float64Array): number {
  assertIncreasingTime(time);
  const departure = nonUniformStep(time);
  if (departure) {
    throw new DiscoveryInputError(
      `The Savitzky-Golay estimator needs uniformly sampled time, but the step before sample ${departure.index} is ` +
        `${departure.step} while the mean step is ${departure.meanStep} (allowed deviation ${UNIFORM_STEP_TOLERANCE * 100} %). ` +
        'Resample the recording or use central differences, which accept uneven steps.');
  }
  return (time[time.length - 1] - time[0]) / (time.length - 1);
}

/**
 * Savitzky-Golay smoothing differentiator (Savitzky & Golay, Anal. Chem. 36 (1964) 1627): a least-squares
 * polynomial of the given order over each centred window gives the smoothed position and its first and second
 * derivatives at the window's centre. Needs uniform sampling. The first and last (window - 1) / 2 samples are
 * trimmed, never extrapolated.
 */
export function savitzkyGolayDerivatives(time: Float64Array, position: Float64Array, window: number, order: number): DerivativeEstimate {
  checkSavitzkyGolaySettings(window, order);
  const n = time.length;
  if (position.length !== n) throw new DiscoveryInputError(`Time has ${n} samples but the position has ${position.length}.`);
  if (n < window) {
    throw new DiscoveryInputError(
      `The Savitzky-Golay window of ${window} samples needs a recording of at least ${window} samples; this one has ${n}.`);
  }
  const step = uniformStepOf(time);
  const half = (window - 1) / 2;
  const data = Array.from(position);
  const filtered = (derivative: number) => {
    const inner = savitzkyGolayFilter(data, step, { windowSize: window, derivative, polynomial: order, pad: 'none' });
    const full = new Float64Array(n).fill(NaN);
    full.set(inner, half);
    return full;
  };
  return { start: half, end: n - half, position: filtered(0), velocity: filtered(1), acceleration: filtered(2) };
}
