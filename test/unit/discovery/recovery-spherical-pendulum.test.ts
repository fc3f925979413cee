import { forcesOf, sphericalTorques } from '../../support/mechanisms/forcing.js';
import { sphericalPendulum } from '../../support/mechanisms/handbook-mechanisms.js';
import { expectHandbookModel, runRecovery, type RecoveryCase, type Run } from './recovery-harness.js';

// Handbook: Goldstein, Classical Mechanics, the spherical pendulum (the mechanism's energyTerms and
// lagrangianTerms). Candidates: the generator's 38 terms for two angles, including sin(th)^2*dph^2 and 35
// wrong ones. th stays away from 0, where the azimuth is singular. Clean positions; Savitzky-Golay window 9,
// order 6 at 100 samples/s.
const runs: Run[] = [
  { q: [0.8, 0], dq: [0, 1.5], role: 'train' },
  { q: [1.2, 1.0], dq: [0.5, -2.0], role: 'train' },
  { q: [0.6, -0.5], dq: [-0.3, 3.0], role: 'train' },
  { q: [1.0, 2.0], dq: [0.4, 1.0], role: 'validate' },
];
const derivatives = { method: 'savitzky-golay', window: 9, order: 6 } as const;
const common = { mechanism: sphericalPendulum, runs, duration: 4, sampleStep: 0.01 };

function forced(form: 'derivative' | 'balance'): RecoveryCase {
  return { ...common, forces: forcesOf(...sphericalTorques), settings: { generate: {}, sizes: { min: 1, max: 4 }, form, derivatives, top: 5 } };
}
function passive(form: 'derivative' | 'balance'): RecoveryCase {
  return { ...common, reference: 'dth^2', settings: { generate: {}, sizes: { min: 1, max: 3 }, form, derivatives, top: 5 } };
}

describe('recovery: spherical pendulum (Goldstein, Classical Mechanics)', () => {
  for (const form of ['derivative', 'balance'] as const) {
    it(`finds the handbook energy and Lagrangian from forced data, ${form} form`, () => {
      expectHandbookModel(runRecovery(forced(form)), sphericalPendulum);
    });
    it(`finds them from passive data with dth^2 as the reference, ${form} form`, () => {
      expectHandbookModel(runRecovery(passive(form)), sphericalPendulum);
    });
  }
});
