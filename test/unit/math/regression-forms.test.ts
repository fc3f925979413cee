import { expect } from 'chai';
import { assembleCandidateSet } from '../../../shared/math/candidate-set.js';
import { DiscoveryInputError } from '../../../shared/math/discovery-input-error.js';
import type { Recording } from '../../../shared/math/recording.js';
import { recordingSignals } from '../../../shared/math/recording-signals.js';
import { buildTrainingSystem, formRows } from '../../../shared/math/regression-system.js';
import { residualSumOfSquares } from '../../../shared/math/refit.js';
import { TermSymbols } from '../../../shared/math/term-symbols.js';
import { sweepSettingsSchema, type SweepSettingsInput } from '../../../shared/schemas/sweep-description.js';
import { forcesOf, pendulumTorque } from '../../support/mechanisms/forcing.js';
import { simplePendulum } from '../../support/mechanisms/handbook-mechanisms.js';
import { simulateRecording } from '../../support/mechanisms/simulate-recording.js';

// A forced pendulum from its handbook equations (Landau & Lifshitz, Mechanics, sec. 5). Physics: dE/dt = u dth
// for the true energy E = m l^2/2 dth^2 - m g l cos th, so the true coefficients must balance both forms.
const symbols = new TermSymbols(['th']);
const truth = simplePendulum.energyTerms;

function recording(name: string, q0: number, options: { measuredVelocity?: boolean; forced?: boolean } = {}): Recording {
  const run = simulateRecording(simplePendulum, {
    initial: { q: [q0], dq: [0.3] },
    duration: 3,
    sampleStep: 0.01,
    ...(options.forced === false ? {} : { forces: forcesOf(pendulumTorque) }),
  });
  return {
    name,
    role: 'train',
    time: run.time,
    positions: run.q,
    velocities: [options.measuredVelocity ? run.dq[0]! : null],
    forces: options.forced === false ? null : run.u,
  };
}

function settingsOf(input: Partial<SweepSettingsInput>) {
  return sweepSettingsSchema.parse({
    coordinates: ['th'],
    terms: Object.keys(truth),
    sizes: { min: 0, max: 1 },
    derivatives: { method: 'savitzky-golay', window: 9, order: 6 },
    ...input,
  });
}

/** Relative residual of the energy balance with the handbook coefficients. */
function balanceResidual(input: Partial<SweepSettingsInput>, recordings: Recording[]): number {
  const settings = settingsOf(input);
  const set = assembleCandidateSet(settings, symbols);
  const terms = set.candidates;
  const needAccelerations = settings.form === 'derivative';
  const signals = recordings.map((r) => recordingSignals(r, symbols, settings.derivatives, needAccelerations));
  const rows = formRows(settings, signals, terms);
  const rss = residualSumOfSquares(rows.columns, terms.map((t) => truth[t.text]!), rows.power!);
  const power = residualSumOfSquares([], [], rows.power!);
  return Math.sqrt(rss / power);
}

describe('regression forms', () => {
  it('the handbook energy balances the derivative form: d E/dt = u dth to 1e-6 relative', () => {
    expect(balanceResidual({ form: 'derivative' }, [recording('a', 0.4), recording('b', -1.0)])).to.be.below(1e-6);
  });

  it('the handbook energy balances the balance form: E(t_b) - E(t_a) = integral of u dth, Simpson and trapezoid', () => {
    const recordings = [recording('a', 0.4), recording('b', -1.0)];
    expect(balanceResidual({ form: 'balance', balance: { window: 20, stride: 5, integration: 'simpson' } }, recordings)).to.be.below(1e-6);
    // The trapezoid rule's error is second order: larger, still small at 100 samples/s.
    expect(balanceResidual({ form: 'balance', balance: { window: 20, stride: 5, integration: 'trapezoid' } }, recordings)).to.be.below(1e-3);
  });

  it('uses measured velocities when the recording has them', () => {
    const residual = balanceResidual({ form: 'balance', derivatives: { method: 'central' } }, [recording('a', 0.4, { measuredVelocity: true })]);
    // Central differences of positions alone leave an error of order h^2; measured velocities remove it.
    const estimated = balanceResidual({ form: 'balance', derivatives: { method: 'central' } }, [recording('a', 0.4)]);
    expect(residual).to.be.below(1e-6);
    expect(estimated).to.be.above(10 * residual);
  });

  it('never lets a row span two recordings: rows per recording add up, windows stay inside each', () => {
    const settings = settingsOf({ form: 'balance', balance: { window: 20, stride: 7, integration: 'simpson' } });
    const terms = assembleCandidateSet(settings, symbols).candidates;
    const a = recordingSignals(recording('a', 0.4), symbols, settings.derivatives, false);
    const b = recordingSignals(recording('b', -1.0), symbols, settings.derivatives, false);
    const windowsOf = (length: number) => Math.floor((length - 1 - 20) / 7) + 1;
    expect(formRows(settings, [a, b], terms).rowCount).to.equal(windowsOf(a.length) + windowsOf(b.length));
    const derivative = settingsOf({ form: 'derivative' });
    const [da, db] = ['a', 'b'].map((name, k) => recordingSignals(recording(name, k ? -1.0 : 0.4), symbols, derivative.derivatives, true));
    expect(formRows(derivative, [da!, db!], terms).rowCount).to.equal(da!.length + db!.length);
    expect(da!.length).to.equal(301 - 8); // Savitzky-Golay window 9 trims 4 samples at each end of each recording.
  });

  it('moves the reference term to the right side: y = -c_ref a_ref on passive data', () => {
    const settings = settingsOf({ form: 'balance', terms: ['cos(th)', 'th^2'], reference: { term: 'dth^2', coefficient: truth['dth^2']! } });
    const set = assembleCandidateSet(settings, symbols);
    const signals = [recordingSignals(recording('a', 0.8, { forced: false }), symbols, settings.derivatives, false)];
    const system = buildTrainingSystem(settings, signals, set, []);
    const referenceRows = formRows(settings, signals, [set.reference!]).columns[0]!;
    system.rhs.forEach((y, i) => expect(y).to.equal(-truth['dth^2']! * referenceRows[i]!));
    // And the handbook potential coefficient balances it.
    const cosColumn = system.columns[system.terms.findIndex((t) => t.text === 'cos(th)')]!;
    expect(Math.sqrt(residualSumOfSquares([cosColumn], [truth['cos(th)']!], system.rhs) / residualSumOfSquares([], [], system.rhs))).to.be.below(1e-6);
  });

  it('leaves out, with a reason, a candidate whose column is zero on the data', () => {
    const run = recording('a', 0.4);
    const still: Recording = { ...run, positions: [...run.positions, new Float64Array(run.time.length).fill(0.25)], velocities: [null, null], forces: [run.forces![0]!, null] };
    const two = new TermSymbols(['th', 'x']);
    const settings = sweepSettingsSchema.parse({
      coordinates: ['th', 'x'],
      terms: ['dth^2', 'cos(th)', 'cos(x)', 'dx^2', 'dth^2*x'],
      sizes: { min: 0, max: 1 },
      form: 'balance',
      derivatives: { method: 'central' },
    });
    const set = assembleCandidateSet(settings, two);
    const excluded: { term: string; reason: string }[] = [];
    const system = buildTrainingSystem(settings, [recordingSignals(still, two, settings.derivatives, false)], set, excluded);
    expect(excluded.map((e) => e.term)).to.deep.equal(['cos(x)', 'dx^2']);
    expect(excluded[0]!.reason).to.contain('does not change');
    expect(excluded[1]!.reason).to.contain('zero on the training data');
    expect(system.terms.map((t) => t.text)).to.deep.equal(['dth^2', 'cos(th)', 'dth^2*x']);
  });

  it('refuses a known term that is zero on the data, naming it', () => {
    const run = recording('a', 0.4);
    const still: Recording = { ...run, positions: [...run.positions, new Float64Array(run.time.length).fill(0.25)], velocities: [null, null], forces: [run.forces![0]!, null] };
    const two = new TermSymbols(['th', 'x']);
    const settings = sweepSettingsSchema.parse({
      coordinates: ['th', 'x'],
      terms: ['dth^2', 'cos(th)'],
      known: ['dx^2'],
      sizes: { min: 0, max: 1 },
      derivatives: { method: 'central' },
    });
    const set = assembleCandidateSet(settings, two);
    expect(() => buildTrainingSystem(settings, [recordingSignals(still, two, settings.derivatives, false)], set, [])).to.throw(
      DiscoveryInputError,
      'Known term "dx^2" cannot be identified',
    );
  });

  it('refuses a term that is not finite on a recording, naming the term, recording and time', () => {
    const settings = settingsOf({ form: 'balance', terms: ['dth^2', 'cos(th)', '1/th'] });
    const set = assembleCandidateSet(settings, symbols);
    const signals = [recordingSignals(recording('swing.csv', 0.4), symbols, settings.derivatives, false)];
    // One sample exactly at th = 0, where 1/th is infinite.
    signals[0]!.samples.column('th')[10] = 0;
    expect(() => buildTrainingSystem(settings, signals, set, [])).to.throw(DiscoveryInputError, 'Term "1/th": its value is not a finite number in swing.csv at time');
  });
});
