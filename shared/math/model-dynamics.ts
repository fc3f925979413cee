import { solveInPlace } from './dense-solve.js';
import type { EquationsOfMotion } from './euler-lagrange.js';
import { compilePoint, type PointFunction } from './point-compiler.js';
import { velocityName } from './term-symbols.js';

/**
 * The equations of motion compiled for numbers: mass matrix, force vector and accelerations at one state.
 * Every method writes into buffers the caller owns and allocates nothing, so a simulation's right side can
 * call them at every stage.
 */
export interface ModelDynamics {
  coordinates: readonly string[];
  /** Number of coordinates. */
  n: number;
  /** M(q, dq), row-major n x n, into `out`. */
  massMatrix(q: ArrayLike<number>, dq: ArrayLike<number>, out: Float64Array): void;
  /** f(q, dq, u) into `out`. */
  forceVector(q: ArrayLike<number>, dq: ArrayLike<number>, u: ArrayLike<number>, out: Float64Array): void;
  /**
   * ddq = M^-1 f into `ddq`. Returns the size of the smallest elimination pivot (above 0, and small near a
   * singular M), or 0 where M is singular to working precision (ddq is then undefined).
   */
  accelerations(q: ArrayLike<number>, dq: ArrayLike<number>, u: ArrayLike<number>, ddq: Float64Array): number;
}

/** Compiles symbolic equations of motion (euler-lagrange.ts) into numeric dynamics. */
export function compileModelDynamics(equations: EquationsOfMotion): ModelDynamics {
  const n = equations.coordinates.length;
  // Slots of the value array: q_0..q_{n-1}, dq_0..dq_{n-1}, u_0..u_{n-1}.
  const slots = new Map<string, number>();
  equations.coordinates.forEach((c, i) => {
    slots.set(c, i);
    slots.set(velocityName(c), n + i);
    slots.set(equations.forceSymbols[i]!, 2 * n + i);
  });
  const massEntries: PointFunction[] = equations.massMatrix.flatMap((row) => row.map((entry) => compilePoint(entry, slots)));
  const forceEntries: PointFunction[] = equations.forceVector.map((entry) => compilePoint(entry, slots));
  const values = new Float64Array(3 * n);
  const matrix = new Float64Array(n * n);

  const load = (q: ArrayLike<number>, dq: ArrayLike<number>, u: ArrayLike<number> | null) => {
    for (let i = 0; i < n; i++) {
      values[i] = q[i]!;
      values[n + i] = dq[i]!;
      values[2 * n + i] = u ? u[i]! : 0;
    }
  };
  const fillMass = (out: Float64Array) => {
    for (let k = 0; k < n * n; k++) out[k] = massEntries[k]!(values);
  };
  const fillForce = (out: Float64Array) => {
    for (let i = 0; i < n; i++) out[i] = forceEntries[i]!(values);
  };

  return {
    coordinates: equations.coordinates,
    n,
    massMatrix(q, dq, out) {
      load(q, dq, null);
      fillMass(out);
    },
    forceVector(q, dq, u, out) {
      load(q, dq, u);
      fillForce(out);
    },
    accelerations(q, dq, u, ddq) {
      load(q, dq, u);
      fillMass(matrix);
      fillForce(ddq);
      return solveInPlace(matrix, ddq, n);
    },
  };
}
