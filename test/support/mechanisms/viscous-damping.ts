import type { Mechanism } from './mechanism.js';

/**
 * The mechanism with viscous friction b_i dq_i acting against each coordinate, which the recordings do not
 * carry: the recorded generalized forces stay the drive's alone, as when a test rig logs its motor torque but
 * not the friction in its bearings. Its energy is no longer conserved, so no energy explains its motion.
 */
export function withViscousDamping(mechanism: Mechanism, damping: number[]): Mechanism {
  return {
    ...mechanism,
    name: `${mechanism.name} with viscous friction`,
    accelerations: (q, dq, u) => mechanism.accelerations(q, dq, u.map((ui, i) => ui - damping[i]! * dq[i]!)),
  };
}
