import { cartPole } from './cart-pole.js';
import { doublePendulum } from './double-pendulum.js';
import type { Mechanism } from './mechanism.js';
import { simplePendulum } from './simple-pendulum.js';
import { sphericalPendulum } from './spherical-pendulum.js';

export { cartPole, doublePendulum, simplePendulum, sphericalPendulum };

/** Every handbook mechanism, for tests that run over all of them. */
export const handbookMechanisms: Mechanism[] = [simplePendulum, cartPole, doublePendulum, sphericalPendulum];
