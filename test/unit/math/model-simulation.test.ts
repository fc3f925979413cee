import { expect } from 'chai';
import { deriveEquationsOfMotion, type LagrangianTerm } from '../../../shared/math/euler-lagrange.js';
import { checkMassMatrix } from '../../../shared/math/mass-matrix-check.js';
import { compileModelDynamics, type ModelDynamics } from '../../../shared/math/model-dynamics.js';
import { compileModelEnergy } from '../../../shared/math/model-energy.js';
import { simulateModel, type SimulationOptions } from '../../../shared/math/model-simulation.js';
import { validateSimulation } from '../../../shared/math/model-validation.js';
import type { Recording } from '../../../shared/math/recording.js';
import { recordingStates } from '../../../shared/math/recording-states.js';
import type { DerivativeSettings } from '../../../shared/schemas/sweep-description.js';
import { cartForce, doublePendulumTorques, forcesOf, onFirstCoordinate } from '../../support/mechanisms/forcing.js';
import { cartPole, doublePendulum, simplePendulum } from '../../support/mechanisms/handbook-mechanisms.js';
import type { Mechanism } from '../../support/mechanisms/mechanism.js';
import { simulateRecording, type SimulationOptions as RecordingOptions } from '../../support/mechanisms/simulate-recording.js';

function handbookDynamics(mechanism: Mechanism): ModelDynamics {
  const terms = Object.entries(mechanism.lagrangianTerms).map(([term, coefficient]) => ({ term, coefficient }));
  return compileModelDynamics(deriveEquationsOfMotion(mechanism.coordinates, terms));
}

/** A recording simulated from the mechanism's hand-written handbook equations. */
function recordingOf(mechanism: Mechanism, options: RecordingOptions, measuredVelocities: boolean): Recording {
  const simulated = simulateRecording(mechanism, options);
  return {
    name: `${mechanism.name} run`,
    role: 'validate',
    time: simulated.time,
    positions: simulated.q,
    velocities: measuredVelocities ? simulated.dq : simulated.q.map(() => null),
    forces: options.forces ? simulated.u : null,
  };
}

const savitzkyGolay: DerivativeSettings = { method: 'savitzky-golay', window: 9, order: 6 };

function run(dynamics: ModelDynamics, mechanism: Mechanism, recording: Recording, options: SimulationOptions = {}, threshold = 0.01) {
  const states = recordingStates(recording, mechanism.coordinates, savitzkyGolay);
  const simulation = simulateModel(dynamics, recording, states, options);
  const energy = compileModelEnergy(mechanism.coordinates, Object.keys(mechanism.energyTerms), Object.values(mechanism.energyTerms));
  return { simulation, figures: validateSimulation(recording, mechanism.coordinates, simulation, energy, { threshold }) };
}

describe('simulating a model through a recording', () => {
  describe('a model built from the handbook Lagrangian reproduces recordings simulated from the handbook equations', () => {
    it('forced double pendulum (Landau & Lifshitz, Mechanics, sec. 5, problem 1), 5 s, measured initial velocity: error below 2e-6 rad', () => {
      const recording = recordingOf(
        doublePendulum,
        { initial: { q: [0.7, -0.4], dq: [0.3, 0.9] }, duration: 5, sampleStep: 0.01, forces: forcesOf(...doublePendulumTorques) },
        true,
      );
      const { simulation, figures } = run(handbookDynamics(doublePendulum), doublePendulum, recording);
      expect(simulation.status).to.equal('finished');
      expect(figures.start).to.equal(0);
      expect(figures.samples).to.equal(501);
      expect(figures.maxError).to.be.below(2e-6);
      expect(figures.timeToThreshold).to.equal(null);
      expect(figures.passive).to.equal(false);
      expect(figures.energyDrift).to.equal(null);
    });

    it('the same with the initial velocity estimated by Savitzky-Golay (window 9, order 6): starts at sample 4, error below 1e-5 rad', () => {
      const recording = recordingOf(
        doublePendulum,
        { initial: { q: [0.7, -0.4], dq: [0.3, 0.9] }, duration: 5, sampleStep: 0.01, forces: forcesOf(...doublePendulumTorques) },
        false,
      );
      const { simulation, figures } = run(handbookDynamics(doublePendulum), doublePendulum, recording);
      expect(simulation.start).to.equal(4);
      expect(figures.start).to.be.closeTo(0.04, 1e-12);
      expect(figures.maxError).to.be.below(1e-5);
    });

    it('cart with a pole driven on the cart only (control textbooks\' cart-pole equations), 4 s: error below 5e-6', () => {
      const recording = recordingOf(
        cartPole,
        { initial: { q: [0, 2.6], dq: [0.2, 0] }, duration: 4, sampleStep: 0.01, forces: onFirstCoordinate(cartForce, 2) },
        true,
      );
      const { figures } = run(handbookDynamics(cartPole), cartPole, recording);
      expect(figures.status).to.equal('finished');
      expect(figures.maxError).to.be.below(5e-6);
    });

    it('passive double pendulum: the energy drifts by less than 1e-8 of its size (physics: passive motion conserves E)', () => {
      const recording = recordingOf(doublePendulum, { initial: { q: [1.2, -0.8], dq: [0, 0] }, duration: 8, sampleStep: 0.01 }, true);
      const { figures } = run(handbookDynamics(doublePendulum), doublePendulum, recording, { rtol: 1e-10, atol: 1e-12 });
      expect(figures.passive).to.equal(true);
      expect(figures.energyDrift!.relative).to.be.below(1e-8);
      expect(figures.energyDrift!.scale).to.be.above(1);
    });
  });

  it('reads forces between samples: straight lines leave a bias of order dt^2 that the cubic reading removes', () => {
    const recording = recordingOf(
      doublePendulum,
      { initial: { q: [0.7, -0.4], dq: [0.3, 0.9] }, duration: 5, sampleStep: 0.01, forces: forcesOf(...doublePendulumTorques) },
      true,
    );
    const dynamics = handbookDynamics(doublePendulum);
    const linear = run(dynamics, doublePendulum, recording, { forceInterpolation: 'linear' }).figures.maxError;
    const cubic = run(dynamics, doublePendulum, recording, { forceInterpolation: 'cubic' }).figures.maxError;
    expect(linear).to.be.above(10 * cubic);
    expect(linear).to.be.below(1e-3);
  });

  it('times when the error passes the threshold, as the closed form of a small harmonic swing predicts for a 5 % faster model', () => {
    // Small swing of the pendulum (amplitude 0.01 rad): th = A cos(w t) with w = sqrt(g/l) (Landau & Lifshitz,
    // Mechanics, sec. 21). A model whose gravity term is 1.1025 times too large swings at 1.05 w; its error is
    // A |cos(1.05 w t) - cos(w t)|, first above the threshold at the sample the closed form names.
    const { m, l, g } = simplePendulum.parameters as Record<string, number>;
    const amplitude = 0.01;
    const threshold = 0.002;
    const recording = recordingOf(simplePendulum, { initial: { q: [amplitude], dq: [0] }, duration: 6, sampleStep: 0.01 }, true);
    const model: LagrangianTerm[] = [
      { term: 'dth^2', coefficient: (m! * l! * l!) / 2 },
      { term: 'cos(th)', coefficient: 1.1025 * m! * g! * l! },
    ];
    const dynamics = compileModelDynamics(deriveEquationsOfMotion(['th'], model));
    const { figures } = run(dynamics, simplePendulum, recording, {}, threshold);
    const w = Math.sqrt(g! / l!);
    const closedForm = Array.from(recording.time).map((t) => amplitude * Math.abs(Math.cos(1.05 * w * t) - Math.cos(w * t)));
    const expected = recording.time[closedForm.findIndex((e) => e > threshold)]!;
    expect(figures.timeToThreshold).to.be.closeTo(expected, 0.0100001);
    expect(figures.errors[0]!.max).to.be.closeTo(Math.max(...closedForm), 1e-5);
  });

  describe('a model whose kinetic energy is not positive definite', () => {
    // Deliberately wrong: L = (a + b cos th) dth^2 + k cos th with b < 0 and |b| > a, so M = 2 (a + b cos th)
    // is negative where cos th > -a/b (near the bottom) and positive beyond.
    const a = 0.05;
    const b = -0.08;
    const wrong: LagrangianTerm[] = [
      { term: 'dth^2', coefficient: a },
      { term: 'dth^2*cos(th)', coefficient: b },
      { term: 'cos(th)', coefficient: 1 },
    ];
    const dynamics = compileModelDynamics(deriveEquationsOfMotion(['th'], wrong));
    const recording = recordingOf(simplePendulum, { initial: { q: [2.5], dq: [0] }, duration: 3, sampleStep: 0.01 }, true);

    it('is reported on exactly the recorded states where a + b cos th <= 0, by index and time', () => {
      const states = recordingStates(recording, ['th'], savitzkyGolay);
      const check = checkMassMatrix(dynamics, states);
      const expected = Array.from(recording.time.keys()).filter((k) => a + b * Math.cos(recording.positions[0]![k]!) <= 0);
      expect(expected.length).to.be.above(20);
      expect(check.checkedStates).to.equal(recording.time.length);
      expect(check.notPositiveDefinite).to.equal(expected.length);
      expect(check.states.map((s) => s.index)).to.deep.equal(expected.slice(0, 50));
      expect(check.states[0]!.time).to.equal(recording.time[expected[0]!]);
      const runs: { from: number; to: number; samples: number }[] = [];
      expected.forEach((k, j) => {
        if (j > 0 && expected[j - 1] === k - 1) {
          runs[runs.length - 1]!.to = recording.time[k]!;
          runs[runs.length - 1]!.samples++;
        } else runs.push({ from: recording.time[k]!, to: recording.time[k]!, samples: 1 });
      });
      expect(runs.length).to.be.above(1);
      expect(check.intervals).to.deep.equal(runs);
      expect(check.smallestPivotRatio).to.be.below(0);
    });

    it('stops the simulation where the mass matrix turns singular and reports the time', () => {
      const { simulation, figures } = run(dynamics, simplePendulum, recording);
      expect(simulation.status).to.equal('singular-mass-matrix');
      expect(figures.status).to.equal('singular-mass-matrix');
      expect(figures.message).to.contain('singular near t =');
      // The simulated angle approaches the zero of a + b cos th, arccos(-a/b), where it stops.
      const last = simulation.q[0]![simulation.q[0]!.length - 1]!;
      expect(last).to.be.above(Math.acos(-a / b));
      expect(simulation.stoppedAt).to.be.a('number').and.to.be.below(3);
      expect(figures.end).to.be.at.most(simulation.stoppedAt!);
    });

    it('passes the mass-matrix check of the handbook model on the same recording', () => {
      const check = checkMassMatrix(handbookDynamics(simplePendulum), recordingStates(recording, ['th'], savitzkyGolay));
      expect(check.notPositiveDefinite).to.equal(0);
      expect(check.smallestPivotRatio).to.equal(1);
    });
  });
});
