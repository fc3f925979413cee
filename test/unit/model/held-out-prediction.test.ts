import { expect } from 'chai';
import { discover } from '../../../shared/math/discover.js';
import type { Recording } from '../../../shared/math/recording.js';
import { workOutModelDetails } from '../../../shared/model/model-details.js';
import { modelDocumentFromDiscovery } from '../../../shared/model/model-document.js';
import type { ModelValidation } from '../../../shared/schemas/model-validation.js';
import { sweepSettingsSchema, type DerivativeSettings } from '../../../shared/schemas/sweep-description.js';
import { doublePendulumTorques, forcesOf } from '../../support/mechanisms/forcing.js';
import { doublePendulum } from '../../support/mechanisms/handbook-mechanisms.js';
import { simulateRecording } from '../../support/mechanisms/simulate-recording.js';

/*
 * The whole product path on a mechanism of our own parameters: a model is discovered from ONE forced recording
 * of the double pendulum (Landau & Lifshitz, Mechanics, sec. 5, problem 1, simulated from its hand-written
 * equations), turned into equations of motion, and simulated against a held-out recording of the same system
 * started elsewhere (same torques, 6 s at 100 samples/s). The expected value is the recording itself.
 */

const forces = forcesOf(...doublePendulumTorques);

function forcedRun(name: string, role: 'train' | 'validate', q0: number[], noise: { sigma: number; seed: number } | null): Recording {
  const simulated = simulateRecording(doublePendulum, {
    initial: { q: q0, dq: [0, 0] },
    duration: 6,
    sampleStep: 0.01,
    forces,
    ...(noise ? { positionNoise: noise } : {}),
  });
  return { name, role, time: simulated.time, positions: simulated.q, velocities: [null, null], forces: simulated.u };
}

function discoverAndPredict(noise: number, derivatives: DerivativeSettings): { energy: string; figures: ModelValidation } {
  const train = forcedRun('train', 'train', [0.9, -0.5], noise > 0 ? { sigma: noise, seed: 101 } : null);
  const heldOut = forcedRun('held-out', 'validate', [-0.6, 0.8], noise > 0 ? { sigma: noise, seed: 102 } : null);
  // The generator's 38 candidate terms for two angles, models of 1 to 5 terms.
  const settings = sweepSettingsSchema.parse({ coordinates: ['th1', 'th2'], generate: {}, sizes: { min: 1, max: 5 }, derivatives, top: 5 });
  const result = discover(settings, [train]);
  const document = modelDocumentFromDiscovery(result.models[0]!, settings.coordinates, {
    source: 'held-out prediction test',
    form: result.form,
    estimator: derivatives,
    recordings: [{ name: 'train', role: 'train' }],
    sweep: null,
    scores: null,
  });
  const details = workOutModelDetails(document, [heldOut], { threshold: 0.05 });
  return { energy: document.energy.expression, figures: details.validations[0]!.figures };
}

function report(label: string, figures: ModelValidation): void {
  const errors = figures.errors.map((e) => `${e.coordinate} rms ${e.rms.toExponential(2)} rad, max ${e.max.toExponential(2)} rad`).join('; ');
  const lost = figures.timeToThreshold === null ? 'never' : `${Number(figures.timeToThreshold.toFixed(3))} s`;
  console.log(`      held-out prediction (${label}), ${figures.start}-${figures.end} s: ${errors}; error above 0.05 rad after: ${lost}`);
}

describe('held-out prediction: discovered from one recording, simulated against another', function () {
  this.timeout(120_000);

  it('clean positions: the discovered double pendulum follows a held-out 6 s forced run with rms error below 1e-4 rad per angle', () => {
    const { energy, figures } = discoverAndPredict(0, { method: 'savitzky-golay', window: 9, order: 6 });
    report('clean', figures);
    expect(energy).to.contain('cos(th1 - th2)');
    expect(figures.status).to.equal('finished');
    expect(figures.end).to.equal(6);
    for (const e of figures.errors) expect(e.rms).to.be.below(1e-4);
    expect(figures.maxError).to.be.below(5e-4);
    expect(figures.timeToThreshold).to.equal(null);
  });

  it('positions with 1e-3 rad noise (Savitzky-Golay window 15, order 4): the prediction stays within 0.05 rad for at least 0.8 s', () => {
    const { figures } = discoverAndPredict(1e-3, { method: 'savitzky-golay', window: 15, order: 4 });
    report('1e-3 rad noise', figures);
    expect(figures.status).to.equal('finished');
    expect(figures.timeToThreshold).to.be.a('number').and.to.be.at.least(0.8);
  });
});
