import { STANDARD_GRAVITY, type Mechanism } from './mechanism.js';

// Our parameters: a 1.13 kg cart carrying a 0.21 kg point mass on a light 0.47 m pole.
const M = 1.13;
const m = 0.21;
const l = 0.47;
const g = STANDARD_GRAVITY;

/**
 * Cart with a pole, th from the upright, force u_x on the cart and torque u_th on the pole.
 * L = (M+m)/2 dx^2 + m l dx dth cos th + m l^2/2 dth^2 - m g l cos th (point mass at the pole's end).
 * The closed form of the control textbooks, with the pole torque kept (it vanishes when u_th = 0):
 *   ddx  = (u_x + m sin th (l dth^2 - g cos th) - u_th cos th / l) / (M + m sin^2 th)
 *   ddth = ((M+m) g sin th - u_x cos th - m l dth^2 sin th cos th + (M+m) u_th / (m l)) / (l (M + m sin^2 th))
 */
export const cartPole: Mechanism = {
  name: 'cart with a pole',
  source: 'cart-pole equations of motion of control textbooks (point mass at the end of the pole, th from upright)',
  coordinates: ['x', 'th'],
  parameters: { M, m, l, g },
  actuated: ['x'],
  accelerations([, th], [, dth], [ux, uth]) {
    const s = Math.sin(th);
    const c = Math.cos(th);
    const denominator = M + m * s * s;
    const ddx = (ux + m * s * (l * dth * dth - g * c) - (uth * c) / l) / denominator;
    const ddth = ((M + m) * g * s - ux * c - m * l * dth * dth * s * c + ((M + m) * uth) / (m * l)) / (l * denominator);
    return [ddx, ddth];
  },
  energy([, th], [dx, dth]) {
    return 0.5 * (M + m) * dx * dx + m * l * dx * dth * Math.cos(th) + 0.5 * m * l * l * dth * dth + m * g * l * Math.cos(th);
  },
  energyTerms: {
    'dx^2': 0.5 * (M + m),
    'dx*dth*cos(th)': m * l,
    'dth^2': 0.5 * m * l * l,
    'cos(th)': m * g * l,
  },
  lagrangianTerms: {
    'dx^2': 0.5 * (M + m),
    'dx*dth*cos(th)': m * l,
    'dth^2': 0.5 * m * l * l,
    'cos(th)': -m * g * l,
  },
};
