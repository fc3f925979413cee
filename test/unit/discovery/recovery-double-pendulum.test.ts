import { doublePendulumTorques, forcesOf } from '../../support/mechanisms/forcing.js';
import { doublePendulum } from '../../support/mechanisms/handbook-mechanisms.js';
import { expectHandbookModel, runRecovery, type RecoveryCase, type Run } from './recovery-harness.js';

// Handbook: Landau & Lifshitz, Mechanics, sec. 5, problem 1 (the mechanism's energyTerms and lagrangianTerms).
// Candidates: the generator's 38 terms for two angles (checked in term-generator.test.ts), which hold the five
// true terms and 33 plausible wrong ones. Clean positions; Savitzky-Golay window 9, order 6 at 100 samples/s.
const runs: Run[] = [
  { q: [0.9, -0.5], dq: [0, 1.2], role: 'train' },
  { q: [-0.4, 1.1], dq: [1.5, 0], role: 'train' },
  { q: [1.3, 0.8], dq: [-0.8, 0.6], role: 'train' },
  { q: [0.2, -1.0], dq: [0.6, -1.8], role: 'validate' },
];
const derivatives = { method: 'savitzky-golay', window: 9, order: 6 } as const;
const common = { mechanism: doublePendulum, runs, duration: 4, sampleStep: 0.01 };

function forced(form: 'derivative' | 'balance'): RecoveryCase {
  return { ...common, forces: forcesOf(...doublePendulumTorques), settings: { generate: {}, sizes: { min: 1, max: 5 }, form, derivatives, top: 5 } };
}
function passive(form: 'derivative' | 'balance'): RecoveryCase {
  return { ...common, reference: 'dth1^2', settings: { generate: {}, sizes: { min: 1, max: 4 }, form, derivatives, top: 5 } };
}

describe('recovery: double pendulum (Landau & Lifshitz, Mechanics, sec. 5, problem 1)', () => {
  for (const form of ['derivative', 'balance'] as const) {
    it(`finds the handbook energy and Lagrangian from forced data, ${form} form`, () => {
      expectHandbookModel(runRecovery(forced(form)), doublePendulum);
    });
    it(`finds them from passive data with dth1^2 as the reference, ${form} form`, () => {
      expectHandbookModel(runRecovery(passive(form)), doublePendulum);
    });
  }
});
