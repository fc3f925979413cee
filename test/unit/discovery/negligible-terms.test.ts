import { expect } from 'chai';
import { NEGLIGIBLE_ENERGY_CHANGE } from '../../../shared/math/negligible-terms.js';
import { forcesOf, pendulumTorque } from '../../support/mechanisms/forcing.js';
import { simplePendulum } from '../../support/mechanisms/handbook-mechanisms.js';
import type { Mechanism } from '../../support/mechanisms/mechanism.js';
import { simulateRecording } from '../../support/mechanisms/simulate-recording.js';
import { expectHandbookModel, runRecovery, type Run } from './recovery-harness.js';

const { m, l, g } = simplePendulum.parameters as Record<'m' | 'l' | 'g', number>;

// The command-line example's situation: a forced pendulum (Landau & Lifshitz, Mechanics, sec. 5), one
// recording of 3 s at 100 samples/s, no validation recording, so models are ranked by BIC; the derivative form
// with the default Savitzky-Golay estimator (window 9, order 4); dth^2 known and five other candidates.
const exampleTerms = ['dth^2', 'cos(th)', 'sin(th)', 'th^2', 'dth^2*cos(th)', 'cos(2*th)'];

type Estimator = { method: 'central' } | { method: 'savitzky-golay'; window: number; order: number };

function forcedPendulum(startAngle: number, derivatives: Estimator) {
  return runRecovery({
    mechanism: simplePendulum,
    runs: [{ q: [startAngle], dq: [0], role: 'train' }],
    duration: 3,
    sampleStep: 0.01,
    forces: forcesOf(pendulumTorque),
    settings: { terms: exampleTerms, known: ['dth^2'], sizes: { min: 0, max: 2 }, form: 'derivative', derivatives, top: 5 },
  });
}

// A pendulum with a weak torsion spring at the pivot: the simple pendulum's Lagrangian (Landau & Lifshitz,
// Mechanics, sec. 5) minus the spring's potential k th^2/2 (a linear torsion spring, from memory), so
// m l^2 ddth = -m g l sin th - k th + u. The spring is our choice, weak enough that its energy is about 1e-3 of
// the energy's variation: small, but ten times the negligible share, so the rule must keep it.
const k = 0.002;
const springPendulum: Mechanism = {
  name: 'pendulum with a weak torsion spring',
  source: 'Landau & Lifshitz, Mechanics, sec. 5 (plane pendulum) plus a linear torsion spring, from memory',
  coordinates: ['th'],
  parameters: { m, l, g, k },
  actuated: ['th'],
  accelerations([th], _dq, [u]) {
    return [(-m * g * l * Math.sin(th!) - k * th! + u!) / (m * l * l)];
  },
  energy([th], [dth]) {
    return 0.5 * m * l * l * dth! * dth! - m * g * l * Math.cos(th!) + 0.5 * k * th! * th!;
  },
  energyTerms: { 'dth^2': 0.5 * m * l * l, 'cos(th)': -m * g * l, 'th^2': 0.5 * k },
  lagrangianTerms: { 'dth^2': 0.5 * m * l * l, 'cos(th)': m * g * l, 'th^2': -0.5 * k },
};
const springRuns: Run[] = [
  { q: [0.5], dq: [0], role: 'train' },
  { q: [-1.2], dq: [0.5], role: 'train' },
  { q: [0.2], dq: [3.5], role: 'validate' },
];

/** rms of the spring's energy about its mean over the rms of the whole energy about its mean, on exact states. */
function springShare(): number {
  const spring: number[] = [];
  const total: number[] = [];
  for (const run of springRuns.filter((r) => r.role === 'train')) {
    const options = { initial: run, duration: 4, sampleStep: 0.01, forces: forcesOf(pendulumTorque) };
    const recording = simulateRecording(springPendulum, options);
    recording.qExact[0]!.forEach((th, i) => {
      spring.push(0.5 * k * th * th);
      total.push(springPendulum.energy([th], [recording.dq[0]![i]!]));
    });
  }
  const spread = (values: number[]) => {
    const mean = values.reduce((a, b) => a + b, 0) / values.length;
    return Math.sqrt(values.reduce((sum, v) => sum + (v - mean) ** 2, 0) / values.length);
  };
  return spread(spring) / spread(total);
}

describe('negligible terms: a term that changes the energy by less than 1e-4 of its variation is left out', () => {
  for (const [label, startAngle, derivatives] of [
    ['Savitzky-Golay window 9, order 4', 0.3, { method: 'savitzky-golay', window: 9, order: 4 }],
    ['central differences', 0.8, { method: 'central' }],
  ] as const) {
    it(`forced pendulum, one recording, ranked by BIC (${label}): exactly dth^2 + cos(th), the extra term dropped`, () => {
      const result = forcedPendulum(startAngle, derivatives);
      expectHandbookModel(result, simplePendulum);
      const simplification = result.simplification;
      expect(simplification, 'no term was dropped').to.be.an('object');
      expect(simplification!.dropped).to.have.length.at.least(1);
      for (const dropped of simplification!.dropped) expect(dropped.energyChange).to.be.below(NEGLIGIBLE_ENERGY_CHANGE);
      // The model it came from follows, and BIC alone would have chosen it by far more than the tie margin.
      const [chosen, bicWinner] = result.models;
      expect(bicWinner!.terms).to.deep.equal(simplification!.from);
      expect(bicWinner!.bic).to.be.below(chosen!.bic - result.rankingTolerance);
      expect(result.warnings.join(' ')).to.contain('was simplified by leaving out');
    });
  }

  it('keeps a small true term: a torsion spring holding about 1e-3 of the energy\'s variation', () => {
    const share = springShare();
    expect(share).to.be.within(5 * NEGLIGIBLE_ENERGY_CHANGE, 2e-3);
    for (const form of ['derivative', 'balance'] as const) {
      const result = runRecovery({
        mechanism: springPendulum,
        runs: springRuns,
        duration: 4,
        sampleStep: 0.01,
        forces: forcesOf(pendulumTorque),
        settings: {
          generate: {},
          sizes: { min: 0, max: 4 },
          form,
          derivatives: { method: 'savitzky-golay', window: 9, order: 6 },
          top: 5,
        },
      });
      expectHandbookModel(result, springPendulum);
    }
  });
});
