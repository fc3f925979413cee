import { doublePendulumTorques, forcesOf } from '../../support/mechanisms/forcing.js';
import { doublePendulum } from '../../support/mechanisms/handbook-mechanisms.js';
import { expectSameTerms, type RecoveryCase, type Run } from './recovery-harness.js';

// Double pendulum (Landau & Lifshitz, Mechanics, sec. 5, problem 1), forced on both joints, with Gaussian noise
// on every sampled angle at 100 samples/s. Both forms get the same Savitzky-Golay estimator (window 9, order 4),
// the same generated 38 candidates, three training runs and one validation run. The derivative form needs
// accelerations, which the estimator makes from the noisy angles by differentiating twice; the balance form
// integrates instead.
const runs: Run[] = [
  { q: [0.9, -0.5], dq: [0, 1.2], role: 'train' },
  { q: [-0.4, 1.1], dq: [1.5, 0], role: 'train' },
  { q: [1.3, 0.8], dq: [-0.8, 0.6], role: 'train' },
  { q: [0.2, -1.0], dq: [0.6, -1.8], role: 'validate' },
];

/** The noisy double pendulum case with position noise of standard deviation `sigma` (rad); 0 for clean data. */
export function noisyDoublePendulum(form: 'derivative' | 'balance', sigma: number): RecoveryCase {
  return {
    mechanism: doublePendulum,
    runs,
    duration: 4,
    sampleStep: 0.01,
    forces: forcesOf(...doublePendulumTorques),
    ...(sigma > 0 ? { positionNoise: { sigma, seed: 11 } } : {}),
    settings: {
      generate: {},
      sizes: { min: 1, max: 5 },
      form,
      derivatives: { method: 'savitzky-golay', window: 9, order: 4 },
      balance: { window: 20, stride: 5 },
      top: 5,
    },
  };
}

/** The worst relative coefficient error when the model has exactly the handbook terms, else null. */
export function handbookError(model: { terms: string[]; coefficients: number[] }): number | null {
  try {
    return expectSameTerms(model, doublePendulum.energyTerms, doublePendulum.coordinates, Infinity);
  } catch {
    return null;
  }
}
