/**
 * A mechanism whose equations of motion are taken from a handbook and written out by hand, so simulated
 * recordings never depend on the engine under test. Physical parameters are our own choice.
 *
 * Term notation is the one users type: coordinate names, velocities `d<name>`, `^` with integer exponents,
 * `*`, `sin`, `cos` and coordinate differences such as `cos(th1 - th2)`.
 */
export interface Mechanism {
  name: string;
  /** The handbook the Lagrangian and equations of motion come from. */
  source: string;
  /** Generalized coordinates; the velocity of `x` is `dx`. */
  coordinates: string[];
  /** Our parameter values (SI units), for messages and for recomputing expected values in tests. */
  parameters: Record<string, number>;
  /** Coordinates usually driven by a generalized force (the others get zero). */
  actuated: string[];
  /** ddq from the handbook equations of motion, with generalized forces u (one per coordinate). */
  accelerations(q: number[], dq: number[], u: number[]): number[];
  /** Total energy T + V. */
  energy(q: number[], dq: number[]): number;
  /** The true energy as {term: coefficient}. */
  energyTerms: Record<string, number>;
  /** The handbook Lagrangian T - V as {term: coefficient}. */
  lagrangianTerms: Record<string, number>;
}

/** Standard gravity g0 (CGPM 1901). */
export const STANDARD_GRAVITY = 9.80665;
