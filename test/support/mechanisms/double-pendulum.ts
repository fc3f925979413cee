import { STANDARD_GRAVITY, type Mechanism } from './mechanism.js';

// Our parameters: point masses of 0.43 kg and 0.29 kg on light rods of 0.38 m and 0.31 m.
const m1 = 0.43;
const m2 = 0.29;
const l1 = 0.38;
const l2 = 0.31;
const g = STANDARD_GRAVITY;

/**
 * Coplanar double pendulum of point masses, angles from the downward vertical, torques u1 on th1 and u2 on th2
 * (Landau & Lifshitz, Mechanics, sec. 5, problem 1):
 *   L = (m1+m2)/2 l1^2 dth1^2 + m2/2 l2^2 dth2^2 + m2 l1 l2 dth1 dth2 cos(th1 - th2)
 *       + (m1+m2) g l1 cos th1 + m2 g l2 cos th2.
 * Its Euler-Lagrange equations, with d = th1 - th2:
 *   (m1+m2) l1^2 ddth1 + m2 l1 l2 cos d ddth2 = u1 - m2 l1 l2 sin d dth2^2 - (m1+m2) g l1 sin th1
 *   m2 l1 l2 cos d ddth1 + m2 l2^2 ddth2     = u2 + m2 l1 l2 sin d dth1^2 - m2 g l2 sin th2
 * solved by Cramer's rule.
 */
export const doublePendulum: Mechanism = {
  name: 'double pendulum',
  source: 'Landau & Lifshitz, Mechanics, sec. 5, problem 1',
  coordinates: ['th1', 'th2'],
  parameters: { m1, m2, l1, l2, g },
  actuated: ['th1', 'th2'],
  accelerations([th1, th2], [dth1, dth2], [u1, u2]) {
    const d = th1 - th2;
    const a11 = (m1 + m2) * l1 * l1;
    const a12 = m2 * l1 * l2 * Math.cos(d);
    const a22 = m2 * l2 * l2;
    const b1 = u1 - m2 * l1 * l2 * Math.sin(d) * dth2 * dth2 - (m1 + m2) * g * l1 * Math.sin(th1);
    const b2 = u2 + m2 * l1 * l2 * Math.sin(d) * dth1 * dth1 - m2 * g * l2 * Math.sin(th2);
    const determinant = a11 * a22 - a12 * a12;
    return [(a22 * b1 - a12 * b2) / determinant, (a11 * b2 - a12 * b1) / determinant];
  },
  energy([th1, th2], [dth1, dth2]) {
    const kinetic = 0.5 * (m1 + m2) * l1 * l1 * dth1 * dth1 + 0.5 * m2 * l2 * l2 * dth2 * dth2
      + m2 * l1 * l2 * dth1 * dth2 * Math.cos(th1 - th2);
    const potential = -(m1 + m2) * g * l1 * Math.cos(th1) - m2 * g * l2 * Math.cos(th2);
    return kinetic + potential;
  },
  energyTerms: {
    'dth1^2': 0.5 * (m1 + m2) * l1 * l1,
    'dth2^2': 0.5 * m2 * l2 * l2,
    'dth1*dth2*cos(th1 - th2)': m2 * l1 * l2,
    'cos(th1)': -(m1 + m2) * g * l1,
    'cos(th2)': -m2 * g * l2,
  },
  lagrangianTerms: {
    'dth1^2': 0.5 * (m1 + m2) * l1 * l1,
    'dth2^2': 0.5 * m2 * l2 * l2,
    'dth1*dth2*cos(th1 - th2)': m2 * l1 * l2,
    'cos(th1)': (m1 + m2) * g * l1,
    'cos(th2)': m2 * g * l2,
  },
};
