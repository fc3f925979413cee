import { expect } from 'chai';
import { windowStarts } from '../../../shared/math/balance-form.js';
import { prepareTerm } from '../../../shared/math/candidate-term.js';
import { energyBalanceResidual } from '../../../shared/math/energy-balance-residual.js';
import { rootMeanSquare } from '../../../shared/math/form-rows.js';
import { recordingSignals } from '../../../shared/math/recording-signals.js';
import type { FormSettings } from '../../../shared/math/regression-system.js';
import { TermSymbols } from '../../../shared/math/term-symbols.js';
import { defaultBalanceSettings } from '../../../shared/schemas/sweep-description.js';
import { doublePendulumTorques, forcesOf } from '../../support/mechanisms/forcing.js';
import { doublePendulum } from '../../support/mechanisms/handbook-mechanisms.js';
import { simulateRecording } from '../../support/mechanisms/simulate-recording.js';

// The forced double pendulum simulated from its handbook equations (Landau & Lifshitz, Mechanics, sec. 5,
// problem 1) with our parameters. Physics (method.md section 2): the true energy obeys dE/dt = P with
// P = sum_i u_i dq_i, so its balance residual is only what the derivative estimates leave; an energy with a
// wrong coefficient c_j + dc leaves dc d(theta_j)/dt on top.
const step = 0.01;
const run = simulateRecording(doublePendulum, {
  initial: { q: [0.6, -0.3], dq: [0, 0] },
  duration: 4,
  sampleStep: step,
  forces: forcesOf(...doublePendulumTorques),
});
const symbols = new TermSymbols(doublePendulum.coordinates);
const estimator = { method: 'savitzky-golay', window: 9, order: 6 } as const;
const texts = Object.keys(doublePendulum.energyTerms);
const truth = Object.values(doublePendulum.energyTerms);
const terms = texts.map((text) => prepareTerm(text, symbols));
const recording = { name: 'forced.csv', role: 'train' as const, time: run.time, positions: run.q, velocities: [null, null], forces: run.u };

function residualOf(form: FormSettings['form'], coefficients: readonly number[]) {
  const signals = recordingSignals(recording, symbols, estimator, form === 'derivative');
  return { signals, rows: energyBalanceResidual({ form, balance: defaultBalanceSettings }, signals, terms, coefficients) };
}

/** The handbook coefficients with the one of cos(th2) (the lower link's potential) made 5 % too large. */
const potential = texts.indexOf('cos(th2)');
const wrong = truth.map((c, j) => (j === potential ? c * 1.05 : c));

describe('energy-balance residual of a model (dE/dt = P, method.md section 2)', () => {
  it('is tiny against the input power for the handbook energy, in the derivative form', () => {
    const { rows, signals } = residualOf('derivative', truth);
    expect(rows.residual.length).to.equal(signals.length);
    expect(Array.from(rows.time)).to.deep.equal(Array.from(signals.time));
    expect(rootMeanSquare(rows.residual)).to.be.below(2e-3 * rootMeanSquare(rows.power));
  });

  it('is tiny against the integrated power for the handbook energy, in the balance form, one row per window at its end time', () => {
    const { rows, signals } = residualOf('balance', truth);
    const starts = windowStarts(signals.length, defaultBalanceSettings);
    expect(rows.residual.length).to.equal(starts.length);
    expect(rows.time[0]).to.equal(signals.time[defaultBalanceSettings.window]);
    expect(rows.time[rows.time.length - 1]).to.equal(signals.time[starts.at(-1)! + defaultBalanceSettings.window]);
    expect(rootMeanSquare(rows.residual)).to.be.below(1e-3 * rootMeanSquare(rows.power));
  });

  it('grows large with a 5 % wrong coefficient, by the rate of the mis-weighted term', () => {
    for (const form of ['derivative', 'balance'] as const) {
      const { rows } = residualOf(form, wrong);
      expect(rootMeanSquare(rows.residual), form).to.be.above(5e-2 * rootMeanSquare(rows.power));
    }
    // Derivative form: the extra residual is dc d(cos th2)/dt = -dc sin(th2) dth2, here from the exact
    // simulated states, so it does not lean on our estimator.
    const { rows } = residualOf('derivative', wrong);
    const dc = wrong[potential]! - truth[potential]!;
    const expected = Float64Array.from(rows.time, (t) => {
      const k = Math.round(t / step);
      return -dc * Math.sin(run.qExact[1]![k]!) * run.dq[1]![k]!;
    });
    const difference = Float64Array.from(rows.residual, (r, i) => r - expected[i]!);
    expect(rootMeanSquare(difference)).to.be.below(0.02 * rootMeanSquare(expected));
  });
});
