import { STANDARD_GRAVITY, type Mechanism } from './mechanism.js';

// Our parameters: a 0.61 kg bob on a light 0.83 m rod.
const m = 0.61;
const l = 0.83;
const g = STANDARD_GRAVITY;

/**
 * Spherical pendulum, polar angle th from the downward vertical, azimuth ph, torques u_th and u_ph
 * (Goldstein, Classical Mechanics, the spherical pendulum): L = m l^2/2 (dth^2 + sin^2 th dph^2) + m g l cos th.
 * Euler-Lagrange:
 *   m l^2 ddth - m l^2 sin th cos th dph^2 + m g l sin th = u_th
 *   d/dt (m l^2 sin^2 th dph) = u_ph
 * The azimuth equation is singular at th = 0 (the pole of the coordinates): keep th away from 0.
 */
export const sphericalPendulum: Mechanism = {
  name: 'spherical pendulum',
  source: 'Goldstein, Classical Mechanics (spherical pendulum, th from the downward vertical)',
  coordinates: ['th', 'ph'],
  parameters: { m, l, g },
  actuated: ['th', 'ph'],
  accelerations([th], [dth, dph], [uth, uph]) {
    const s = Math.sin(th);
    const c = Math.cos(th);
    const inertia = m * l * l;
    const ddth = s * c * dph * dph - (g / l) * s + uth / inertia;
    const ddph = (uph / inertia - 2 * s * c * dth * dph) / (s * s);
    return [ddth, ddph];
  },
  energy([th], [dth, dph]) {
    const s = Math.sin(th);
    return 0.5 * m * l * l * (dth * dth + s * s * dph * dph) - m * g * l * Math.cos(th);
  },
  energyTerms: { 'dth^2': 0.5 * m * l * l, 'sin(th)^2*dph^2': 0.5 * m * l * l, 'cos(th)': -m * g * l },
  lagrangianTerms: { 'dth^2': 0.5 * m * l * l, 'sin(th)^2*dph^2': 0.5 * m * l * l, 'cos(th)': m * g * l },
};
