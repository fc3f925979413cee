import { expect } from 'chai';
import { cartForce, onFirstCoordinate } from '../../support/mechanisms/forcing.js';
import { cartPole } from '../../support/mechanisms/handbook-mechanisms.js';
import { expectHandbookModel, expectSameTerms, runRecovery, type RecoveryCase, type Run } from './recovery-harness.js';

// Handbook: the cart-pole of control textbooks, th from upright (the mechanism's energyTerms and
// lagrangianTerms). Candidates: the generator with th as the only angle: x, th, x^2, x*th, th^2, sin(th),
// cos(th), and dx^2, dx*dth, dth^2 each alone and times sin(th), cos(th), sin(th)^2: 19 terms, 4 of them true.
// The force acts on the cart only. Clean positions; Savitzky-Golay window 9, order 6 at 100 samples/s.
const runs: Run[] = [
  { q: [0, 2.6], dq: [0.4, 0], role: 'train' },
  { q: [0.3, -2.9], dq: [-0.6, 1.0], role: 'train' },
  { q: [-0.2, 1.9], dq: [0.2, -0.7], role: 'train' },
  { q: [0.1, 3.0], dq: [0, 2.0], role: 'validate' },
];
const derivatives = { method: 'savitzky-golay', window: 9, order: 6 } as const;
const generate = { angles: ['th'] };
const common = { mechanism: cartPole, runs, duration: 4, sampleStep: 0.01 };

function forced(form: 'derivative' | 'balance'): RecoveryCase {
  return { ...common, forces: onFirstCoordinate(cartForce, 2), settings: { generate, sizes: { min: 1, max: 5 }, form, derivatives, top: 5 } };
}
// Passive data: the free cart conserves the horizontal momentum p = (M+m) dx + m l dth cos th (a cyclic
// coordinate, Landau & Lifshitz, Mechanics, sec. 7), so every E + b p^2 is conserved too and fixing the
// reference coefficient leaves b free. The sparsest member is the energy seen from the centre of mass,
// E - p^2/(2(M+m)), with three terms against the four of E: passive data alone cannot single out E. With
// dx^2 known, E and that invariant need equally many terms, and the sweep says it cannot decide.
function passive(form: 'derivative' | 'balance', known: string[]): RecoveryCase {
  return { ...common, reference: 'cos(th)', settings: { generate, known, sizes: { min: 1, max: 4 }, form, derivatives, top: 5 } };
}

describe('recovery: cart with a pole (control textbooks\' cart-pole, th from upright)', () => {
  for (const form of ['derivative', 'balance'] as const) {
    it(`finds the handbook energy and Lagrangian from data forced on the cart, ${form} form`, () => {
      expectHandbookModel(runRecovery(forced(form)), cartPole);
    });
    it(`finds the centre-of-mass energy E - p^2/(2(M+m)) from passive data with cos(th) as the reference, ${form} form`, () => {
      const { M, m, l, g } = cartPole.parameters as Record<'M' | 'm' | 'l' | 'g', number>;
      // E - p^2/(2(M+m)) = (m l^2/2 - m^2 l^2/(2(M+m))) dth^2 + m^2 l^2/(2(M+m)) sin(th)^2 dth^2 + m g l cos th,
      // expanding p^2 with cos^2 = 1 - sin^2 (by hand, from the handbook energy and momentum above).
      const invariant = {
        'dth^2': (m * l * l) / 2 - (m * m * l * l) / (2 * (M + m)),
        'dth^2*sin(th)^2': (m * m * l * l) / (2 * (M + m)),
        'cos(th)': m * g * l,
      };
      expectSameTerms(runRecovery(passive(form, [])).models[0]!, invariant, cartPole.coordinates, 1e-3);
    });
    it(`keeps the handbook energy among the top two and warns that passive data cannot decide when dx^2 is known, ${form} form`, () => {
      const result = runRecovery(passive(form, ['dx^2']));
      const matches = result.models.slice(0, 2).filter((model) => {
        try {
          expectSameTerms(model, cartPole.energyTerms, cartPole.coordinates, 1e-3);
          return true;
        } catch {
          return false;
        }
      });
      expect(matches).to.have.length(1);
      expect(result.warnings.join(' ')).to.contain('do not decide');
    });
  }
});
