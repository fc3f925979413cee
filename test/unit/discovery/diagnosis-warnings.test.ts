import { expect } from 'chai';
import type { DiscoveryResult } from '../../../shared/schemas/discovery-result.js';
import { forcesOf, pendulumTorque } from '../../support/mechanisms/forcing.js';
import { simplePendulum } from '../../support/mechanisms/handbook-mechanisms.js';
import { withViscousDamping } from '../../support/mechanisms/viscous-damping.js';
import { handbookError, noisyDoublePendulum } from './noisy-double-pendulum.js';
import { runRecovery, type RecoveryCase } from './recovery-harness.js';

// The product says when noise or a missing piece of the energy spoils a result. Cases: the double pendulum of
// noise.test.ts (Landau & Lifshitz, Mechanics, sec. 5, problem 1), whose coefficient errors are measured against
// the handbook energy, and a forced simple pendulum (sec. 5) with viscous friction the recordings do not carry.
const noiseWarning = (result: DiscoveryResult) => result.warnings.find((w) => w.startsWith('Noise:'));
const unexplainedWarning = (result: DiscoveryResult) => result.warnings.find((w) => w.includes('unexplained'));

function dampedPendulum(damping: number): RecoveryCase {
  const mechanism = damping > 0 ? withViscousDamping(simplePendulum, [damping]) : simplePendulum;
  return {
    mechanism,
    runs: [
      { q: [0.5], dq: [0], role: 'train' },
      { q: [-1.2], dq: [0.5], role: 'train' },
    ],
    duration: 8,
    sampleStep: 0.01,
    forces: forcesOf(pendulumTorque),
    settings: { generate: {}, sizes: { min: 0, max: 4 }, form: 'balance', derivatives: { method: 'savitzky-golay', window: 9, order: 6 }, top: 5 },
  };
}

describe('diagnosis warnings: noise in the signals, and residual that noise does not explain', () => {
  it('clean data give neither warning, and report next to no noise per coordinate', () => {
    const result = runRecovery(noisyDoublePendulum('balance', 0));
    expect(noiseWarning(result)).to.equal(undefined);
    expect(unexplainedWarning(result)).to.equal(undefined);
    expect(result.signals.noise!.map((n) => n.coordinate)).to.deep.equal(['th1', 'th2']);
    for (const n of result.signals.noise!) expect(n.velocityShare).to.be.below(1e-4);
  });

  it('the noise effect on the coefficients matches their actual error against the handbook, within a factor of 2', () => {
    for (const sigma of [1e-3, 3e-3]) {
      const result = runRecovery(noisyDoublePendulum('balance', sigma));
      const error = handbookError(result.models[0]!);
      expect(error, `handbook terms at ${sigma} rad`).not.to.equal(null);
      const largest = Math.max(...result.coefficientNoise!.shifts);
      expect(largest, `largest shift at ${sigma} rad against error ${error}`).to.be.within(error! / 2, 2 * error!);
      expect(noiseWarning(result), `at ${sigma} rad`).to.match(/moves the chosen model's coefficients by up to \d/);
    }
    const clean = runRecovery(noisyDoublePendulum('balance', 0));
    expect(Math.max(...clean.coefficientNoise!.shifts)).to.be.below(1e-3);
    expect(clean.coefficientNoise!.terms).to.have.members(clean.models[0]!.terms);
  });

  it('1e-3 rad of position noise: the derivative form is told its accelerations are noisy and pointed to the balance form', () => {
    const result = runRecovery(noisyDoublePendulum('derivative', 1e-3));
    const warning = noiseWarning(result);
    expect(warning, result.warnings.join('\n')).to.be.a('string');
    expect(warning).to.match(/accelerations of th1: \d+(\.\d+)? % noise/);
    expect(warning).to.include('balance form');
    const th1 = result.signals.noise!.find((n) => n.coordinate === 'th1')!;
    expect(th1.positionNoise, 'the estimate of the noise that was added').to.be.closeTo(1e-3, 2e-4);
  });

  it('a candidate set without one true term (cos(th2)) is told something is missing', () => {
    const c = noisyDoublePendulum('balance', 0);
    c.settings = { ...c.settings, generate: { remove: ['cos(th2)'] } };
    const result = runRecovery(c);
    expect(unexplainedWarning(result), result.warnings.join('\n')).to.match(/A term of the true energy may be missing/);
  });

  it('unrecorded viscous friction of damping ratio 0.6 % is named as a possible cause; the same pendulum without it gets no such warning', () => {
    const damped = runRecovery(dampedPendulum(0.005));
    expect(unexplainedWarning(damped), damped.warnings.join('\n')).to.include('friction');
    const undamped = runRecovery(dampedPendulum(0));
    expect(unexplainedWarning(undamped), undamped.warnings.join('\n')).to.equal(undefined);
  });
});
