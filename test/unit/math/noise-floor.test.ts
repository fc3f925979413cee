import { expect } from 'chai';
import { assembleCandidateSet } from '../../../shared/math/candidate-set.js';
import { estimateWhiteNoise, noiseFloorRmse } from '../../../shared/math/noise-floor.js';
import type { Recording } from '../../../shared/math/recording.js';
import { recordingSignals } from '../../../shared/math/recording-signals.js';
import { formRows } from '../../../shared/math/regression-system.js';
import { residualSumOfSquares } from '../../../shared/math/refit.js';
import { createNormalRandom, createSeededRandom } from '../../../shared/math/seeded-random.js';
import { TermSymbols } from '../../../shared/math/term-symbols.js';
import { sweepSettingsSchema } from '../../../shared/schemas/sweep-description.js';
import { forcesOf, pendulumTorque } from '../../support/mechanisms/forcing.js';
import { simplePendulum } from '../../support/mechanisms/handbook-mechanisms.js';
import { simulateRecording } from '../../support/mechanisms/simulate-recording.js';

describe('noise floor', () => {
  // White noise of deviation s gives sixth differences of deviation s sqrt(C(12, 6)) = s sqrt(924) (the sum of
  // squared binomial coefficients, Vandermonde's identity), and the median of |N(0, 1)| is 0.6745 (A & S 26.2,
  // from memory): the estimate should find the s we added.
  it('estimates the deviation of white noise on a smooth signal to within 10 %', () => {
    const normal = createNormalRandom(createSeededRandom(5));
    for (const sigma of [1e-4, 1e-3, 1e-2]) {
      const values = Float64Array.from({ length: 2000 }, (_, k) => Math.sin(0.05 * k) + 0.3 * Math.cos(0.013 * k) + sigma * normal());
      expect(estimateWhiteNoise(values) / sigma, `sigma ${sigma}`).to.be.closeTo(1, 0.1);
    }
  });

  it('finds next to no noise on a clean, finely sampled signal', () => {
    const values = Float64Array.from({ length: 2000 }, (_, k) => Math.sin(0.05 * k));
    // The sixth difference of sin(0.05 k) is at most 0.05^6 = 1.6e-8 (by hand).
    expect(estimateWhiteNoise(values)).to.be.below(1.6e-8 / Math.sqrt(924) / 0.6745);
  });

  it('predicts the residual that noise gives the true model of a noisy pendulum (Landau & Lifshitz, sec. 5)', () => {
    const symbols = new TermSymbols(['th']);
    const settings = sweepSettingsSchema.parse({
      coordinates: ['th'],
      terms: ['dth^2', 'cos(th)'],
      sizes: { min: 0, max: 2 },
      form: 'balance',
      derivatives: { method: 'savitzky-golay', window: 11, order: 3 },
    });
    const recordings: Recording[] = [0.5, -0.9].map((q0, k) => {
      const run = simulateRecording(simplePendulum, {
        initial: { q: [q0], dq: [0] },
        duration: 6,
        sampleStep: 0.01,
        forces: forcesOf(pendulumTorque),
        positionNoise: { sigma: 2e-3, seed: 30 + k },
      });
      return { name: `run ${k}`, role: 'train', time: run.time, positions: run.q, velocities: [null], forces: run.u };
    });
    const terms = assembleCandidateSet(settings, symbols).candidates;
    const coefficients = terms.map((t) => simplePendulum.energyTerms[t.text]!);
    const signals = recordings.map((r) => recordingSignals(r, symbols, settings.derivatives, false));
    const rows = formRows(settings, signals, terms);
    const actual = Math.sqrt(residualSumOfSquares(rows.columns, coefficients, rows.power!) / rows.rowCount);
    const predicted = noiseFloorRmse({ terms, coefficients }, recordings, settings, symbols, false, createNormalRandom(createSeededRandom(8)));
    expect(predicted / actual).to.be.within(0.7, 1.4);
  });
});
