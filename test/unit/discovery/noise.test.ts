import { expect } from 'chai';
import { handbookError, noisyDoublePendulum } from './noisy-double-pendulum.js';
import { runRecovery } from './recovery-harness.js';

// The case is in noisy-double-pendulum.ts: Gaussian noise of 1e-3 rad on every sampled angle (about the
// quantization of a 12-bit encoder); print-noise-figures.ts prints the same comparison for other noise sizes.
describe('noise: double pendulum with 1e-3 rad position noise', () => {
  it('the balance form still finds the handbook terms, coefficients within 5 %', () => {
    const error = handbookError(runRecovery(noisyDoublePendulum('balance', 1e-3)).models[0]!);
    expect(error, 'the balance form missed the handbook terms').not.to.equal(null);
    expect(error).to.be.below(0.05);
  });

  it('the derivative form does not: wrong terms, or coefficients off by more than 20 %', () => {
    const error = handbookError(runRecovery(noisyDoublePendulum('derivative', 1e-3)).models[0]!);
    expect(error === null || error > 0.2, `derivative form coefficient error ${error}`).to.equal(true);
  });
});
