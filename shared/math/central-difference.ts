import type { DerivativeEstimate } from './derivative-estimators.js';
import { DiscoveryInputError } from './discovery-input-error.js';
import { assertIncreasingTime } from './sampling-statistics.js';

/**
 * Three-point finite differences on a possibly non-uniform grid. With h1 = t_i - t_(i-1), h2 = t_(i+1) - t_i:
 *   f'(t_i)  ~ (-h2^2 f_(i-1) + (h2^2 - h1^2) f_i + h1^2 f_(i+1)) / (h1 h2 (h1 + h2))
 *   f''(t_i) ~ 2 (h2 f_(i-1) - (h1 + h2) f_i + h1 f_(i+1)) / (h1 h2 (h1 + h2))
 * Both are exact for quadratics on any grid. The first derivative is second-order accurate on any grid; the
 * second derivative is second-order on a uniform grid and first-order where neighbouring steps differ
 * (its leading error is (h2 - h1) f'''/3). The first and last samples have no estimate.
 * Positions are returned unchanged.
 */
export function centralDifferences(time: Float64Array, position: Float64Array): DerivativeEstimate {
  const n = time.length;
  if (position.length !== n) throw new DiscoveryInputError(`Time has ${n} samples but the position has ${position.length}.`);
  if (n < 3) {
    throw new DiscoveryInputError(`The central-difference estimator needs a recording of at least 3 samples; this one has ${n}.`);
  }
  assertIncreasingTime(time);
  const velocity = new Float64Array(n).fill(NaN);
  const acceleration = new Float64Array(n).fill(NaN);
  for (let i = 1; i < n - 1; i++) {
    const h1 = time[i] - time[i - 1];
    const h2 = time[i + 1] - time[i];
    const denominator = h1 * h2 * (h1 + h2);
    velocity[i] = (-h2 * h2 * position[i - 1] + (h2 * h2 - h1 * h1) * position[i] + h1 * h1 * position[i + 1]) / denominator;
    acceleration[i] = (2 * (h2 * position[i - 1] - (h1 + h2) * position[i] + h1 * position[i + 1])) / denominator;
  }
  return { start: 1, end: n - 1, position: Float64Array.from(position), velocity, acceleration };
}
