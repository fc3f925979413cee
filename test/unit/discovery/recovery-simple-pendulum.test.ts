import { forcesOf, pendulumTorque } from '../../support/mechanisms/forcing.js';
import { simplePendulum } from '../../support/mechanisms/handbook-mechanisms.js';
import { expectHandbookModel, runRecovery, type RecoveryCase, type Run } from './recovery-harness.js';

// Handbook: the simple pendulum, Landau & Lifshitz, Mechanics, sec. 5 (the mechanism's energyTerms and
// lagrangianTerms). Candidates: the generator's 8 terms for one angle (th, th^2, sin, cos, dth^2 and dth^2
// times sin, cos, sin^2). Clean positions; Savitzky-Golay window 9, order 6 at 100 samples/s.
const runs: Run[] = [
  { q: [0.5], dq: [0], role: 'train' },
  { q: [-1.2], dq: [0.5], role: 'train' },
  { q: [0.2], dq: [3.5], role: 'validate' },
];
const derivatives = { method: 'savitzky-golay', window: 9, order: 6 } as const;
const common = { mechanism: simplePendulum, runs, duration: 4, sampleStep: 0.01 };

function forced(form: 'derivative' | 'balance'): RecoveryCase {
  return { ...common, forces: forcesOf(pendulumTorque), settings: { generate: {}, sizes: { min: 0, max: 4 }, form, derivatives, top: 5 } };
}
function passive(form: 'derivative' | 'balance'): RecoveryCase {
  return { ...common, reference: 'dth^2', settings: { generate: {}, sizes: { min: 0, max: 3 }, form, derivatives, top: 5 } };
}

describe('recovery: simple pendulum (Landau & Lifshitz, Mechanics, sec. 5)', () => {
  for (const form of ['derivative', 'balance'] as const) {
    it(`finds the handbook energy and Lagrangian from forced data, ${form} form`, () => {
      expectHandbookModel(runRecovery(forced(form)), simplePendulum);
    });
    it(`finds them from passive data with dth^2 as the reference, ${form} form`, () => {
      expectHandbookModel(runRecovery(passive(form)), simplePendulum);
    });
  }
});
