import { STANDARD_GRAVITY, type Mechanism } from './mechanism.js';

// Our parameters: a 0.37 kg bob on a light 0.52 m rod.
const m = 0.37;
const l = 0.52;
const g = STANDARD_GRAVITY;

/**
 * Plane pendulum, th from the downward vertical, torque u on th. L = m l^2/2 dth^2 + m g l cos th: the double
 * pendulum of Landau & Lifshitz, Mechanics, sec. 5, problem 1 with the lower bob removed (m2 = 0).
 * Equation of motion: m l^2 ddth + m g l sin th = u.
 */
export const simplePendulum: Mechanism = {
  name: 'simple pendulum',
  source: 'Landau & Lifshitz, Mechanics, sec. 5, problem 1 with the lower bob removed (m2 = 0)',
  coordinates: ['th'],
  parameters: { m, l, g },
  actuated: ['th'],
  accelerations([th], _dq, [u]) {
    return [-(g / l) * Math.sin(th) + u / (m * l * l)];
  },
  energy([th], [dth]) {
    return 0.5 * m * l * l * dth * dth - m * g * l * Math.cos(th);
  },
  energyTerms: { 'dth^2': 0.5 * m * l * l, 'cos(th)': -m * g * l },
  lagrangianTerms: { 'dth^2': 0.5 * m * l * l, 'cos(th)': m * g * l },
};
