import type { MassMatrixCheck } from '../schemas/model-validation.js';
import type { ModelDynamics } from './model-dynamics.js';
import type { RecordingStates } from './recording-states.js';

const LISTED_STATES = 50;
const LISTED_INTERVALS = 20;
/** A pivot at or below this fraction of the largest diagonal entry counts as not positive (rounding level). */
const PIVOT_TOLERANCE = 1e-13;

/**
 * Checks that the model's mass matrix is positive definite on every recorded state, by a Cholesky
 * factorisation at each state (it exists exactly for symmetric positive definite matrices). A kinetic energy
 * that is not positive definite means accelerations that point the wrong way or do not exist: the states where
 * it fails are listed by index and time, and grouped into runs of consecutive samples.
 */
export function checkMassMatrix(dynamics: ModelDynamics, states: RecordingStates): MassMatrixCheck {
  const n = dynamics.n;
  const matrix = new Float64Array(n * n);
  const q = new Float64Array(n);
  const dq = new Float64Array(n);
  const failing: number[] = [];
  let smallest: number | null = null;
  for (let k = 0; k < states.time.length; k++) {
    for (let i = 0; i < n; i++) {
      q[i] = states.q[i]![k]!;
      dq[i] = states.dq[i]![k]!;
    }
    dynamics.massMatrix(q, dq, matrix);
    const ratio = smallestCholeskyPivotRatio(matrix, n);
    if (Number.isFinite(ratio)) smallest = smallest === null ? ratio : Math.min(smallest, ratio);
    if (!(ratio > PIVOT_TOLERANCE)) failing.push(k);
  }
  return {
    recording: states.name,
    checkedStates: states.time.length,
    notPositiveDefinite: failing.length,
    intervals: runsOf(failing, states.time).slice(0, LISTED_INTERVALS),
    states: failing.slice(0, LISTED_STATES).map((k) => ({ index: states.start + k, time: states.time[k]! })),
    smallestPivotRatio: smallest,
  };
}

/**
 * Cholesky factorisation of a symmetric matrix, in place on `a` (row-major, lower triangle used): the smallest
 * pivot d_j = a_jj - sum_k l_jk^2 (before its square root) over the largest diagonal entry. The factorisation
 * stops at the first pivot that is not positive and returns that pivot's ratio; NaN when the matrix is not finite.
 */
export function smallestCholeskyPivotRatio(a: Float64Array, n: number): number {
  let scale = 0;
  for (let j = 0; j < n; j++) scale = Math.max(scale, Math.abs(a[j * n + j]!));
  if (!Number.isFinite(scale)) return NaN;
  if (scale === 0) return 0;
  let smallest = Infinity;
  for (let j = 0; j < n; j++) {
    let d = a[j * n + j]!;
    for (let k = 0; k < j; k++) d -= a[j * n + k]! * a[j * n + k]!;
    const ratio = d / scale;
    if (Number.isNaN(ratio)) return NaN;
    smallest = Math.min(smallest, ratio);
    if (!(ratio > PIVOT_TOLERANCE)) return smallest;
    const root = Math.sqrt(d);
    a[j * n + j] = root;
    for (let i = j + 1; i < n; i++) {
      let s = a[i * n + j]!;
      for (let k = 0; k < j; k++) s -= a[i * n + k]! * a[j * n + k]!;
      a[i * n + j] = s / root;
    }
  }
  return smallest;
}

function runsOf(failing: number[], time: Float64Array): MassMatrixCheck['intervals'] {
  const runs: MassMatrixCheck['intervals'] = [];
  let previous = -2;
  for (const k of failing) {
    const last = runs[runs.length - 1];
    if (last && k === previous + 1) {
      last.to = time[k]!;
      last.samples++;
    } else runs.push({ from: time[k]!, to: time[k]!, samples: 1 });
    previous = k;
  }
  return runs;
}
