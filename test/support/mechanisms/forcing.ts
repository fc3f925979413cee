/**
 * Smooth excitation for forced recordings: sums of sines whose frequencies have irrational ratios, so the
 * motion never settles into a periodic pattern. Amplitudes and frequencies are our own choice.
 */
export interface SineComponent {
  amplitude: number;
  /** Hz. */
  frequency: number;
  /** Radians. */
  phase: number;
}

export function sumOfSines(components: SineComponent[]): (t: number) => number {
  return (t) => components.reduce((sum, c) => sum + c.amplitude * Math.sin(2 * Math.PI * c.frequency * t + c.phase), 0);
}

const SQRT2 = Math.SQRT2;
const SQRT3 = Math.sqrt(3);
const SQRT5 = Math.sqrt(5);

/** Torque on the simple pendulum (N m); about a sixth of its largest gravity torque m g l = 1.89 N m. */
export const pendulumTorque = sumOfSines([
  { amplitude: 0.19, frequency: 0.41, phase: 0 },
  { amplitude: 0.11, frequency: 0.41 * SQRT2, phase: 0.7 },
  { amplitude: 0.07, frequency: 0.41 * SQRT5, phase: 1.9 },
]);

/** Horizontal force on the cart (N). */
export const cartForce = sumOfSines([
  { amplitude: 1.3, frequency: 0.29, phase: 0.2 },
  { amplitude: 0.8, frequency: 0.29 * SQRT3, phase: 1.1 },
  { amplitude: 0.45, frequency: 0.29 * SQRT5, phase: 2.6 },
]);

/** Torques on the two joints of the double pendulum (N m). */
export const doublePendulumTorques = [
  sumOfSines([
    { amplitude: 0.23, frequency: 0.37, phase: 0 },
    { amplitude: 0.12, frequency: 0.37 * SQRT3, phase: 0.9 },
  ]),
  sumOfSines([
    { amplitude: 0.09, frequency: 0.37 * SQRT2, phase: 0.4 },
    { amplitude: 0.05, frequency: 0.37 * SQRT5, phase: 2.2 },
  ]),
];

/** Torques on the polar and azimuthal angles of the spherical pendulum (N m). */
export const sphericalTorques = [
  sumOfSines([
    { amplitude: 0.35, frequency: 0.33, phase: 0.3 },
    { amplitude: 0.2, frequency: 0.33 * SQRT5, phase: 1.4 },
  ]),
  sumOfSines([
    { amplitude: 0.12, frequency: 0.33 * SQRT2, phase: 0 },
    { amplitude: 0.06, frequency: 0.33 * SQRT3, phase: 2.0 },
  ]),
];

/** Joins per-coordinate forcing functions into the (t) => u form of simulateRecording. */
export function forcesOf(...perCoordinate: ((t: number) => number)[]): (t: number) => number[] {
  return (t) => perCoordinate.map((f) => f(t));
}

/** Force on the first coordinate only, zero on the rest. */
export function onFirstCoordinate(force: (t: number) => number, coordinateCount: number): (t: number) => number[] {
  return (t) => Array.from({ length: coordinateCount }, (_, i) => (i === 0 ? force(t) : 0));
}
