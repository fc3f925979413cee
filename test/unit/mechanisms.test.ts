import { expect } from 'chai';
import { all, create, type EvalFunction, type MathNode } from 'mathjs';
import { Matrix, solve } from 'ml-matrix';
import { createNormalRandom, createSeededRandom } from '../../shared/math/seeded-random.js';
import { forcesOf, onFirstCoordinate, cartForce, doublePendulumTorques, pendulumTorque, sphericalTorques } from '../support/mechanisms/forcing.js';
import { cartPole, doublePendulum, handbookMechanisms, simplePendulum, sphericalPendulum } from '../support/mechanisms/handbook-mechanisms.js';
import type { Mechanism } from '../support/mechanisms/mechanism.js';
import { recordingToCsv, simulateRecording, type SimulatedRecording } from '../support/mechanisms/simulate-recording.js';

// mathjs is the general-purpose computer algebra here: it parses our term notation and differentiates the
// handbook Lagrangians, independently of the hand-written equations of motion.
const math = create(all, { number: 'number' });

interface Scenario {
  mechanism: Mechanism;
  initial: { q: number[]; dq: number[] };
  forces: (t: number) => number[];
  /** A range of states for random checks (keeps the spherical pendulum off its coordinate pole). */
  randomState: (uniform: () => number) => { q: number[]; dq: number[] };
}

const between = (uniform: () => number, a: number, b: number) => a + (b - a) * uniform();

const scenarios: Scenario[] = [
  {
    mechanism: simplePendulum,
    initial: { q: [1.1], dq: [0] },
    forces: forcesOf(pendulumTorque),
    randomState: (r) => ({ q: [between(r, -3, 3)], dq: [between(r, -6, 6)] }),
  },
  {
    mechanism: cartPole,
    initial: { q: [0, 2.5], dq: [0.1, 0] },
    forces: onFirstCoordinate(cartForce, 2),
    randomState: (r) => ({ q: [between(r, -1, 1), between(r, -3, 3)], dq: [between(r, -2, 2), between(r, -6, 6)] }),
  },
  {
    mechanism: doublePendulum,
    initial: { q: [0.8, -0.5], dq: [0, 1] },
    forces: forcesOf(...doublePendulumTorques),
    randomState: (r) => ({ q: [between(r, -3, 3), between(r, -3, 3)], dq: [between(r, -5, 5), between(r, -5, 5)] }),
  },
  {
    mechanism: sphericalPendulum,
    initial: { q: [0.9, 0], dq: [0, 3] },
    forces: forcesOf(...sphericalTorques),
    randomState: (r) => ({ q: [between(r, 0.3, 2.8), between(r, -3, 3)], dq: [between(r, -4, 4), between(r, -4, 4)] }),
  },
];

function termSum(terms: Record<string, number>): MathNode {
  return math.parse(Object.entries(terms).map(([term, c]) => `(${c}) * (${term})`).join(' + '));
}

function scopeOf(mechanism: Mechanism, q: number[], dq: number[]): Record<string, number> {
  const scope: Record<string, number> = {};
  mechanism.coordinates.forEach((name, i) => {
    scope[name] = q[i];
    scope[`d${name}`] = dq[i];
  });
  return scope;
}

/** Euler-Lagrange with forces, d/dt dL/d(dq) - dL/dq = u, as M ddq = f, each entry differentiated by mathjs. */
function symbolicEquationsOfMotion(mechanism: Mechanism) {
  const lagrangian = termSum(mechanism.lagrangianTerms);
  const names = mechanism.coordinates;
  const momenta = names.map((name) => math.derivative(lagrangian, `d${name}`));
  const mass: EvalFunction[][] = momenta.map((p) => names.map((name) => math.derivative(p, `d${name}`).compile()));
  const mixed: EvalFunction[][] = momenta.map((p) => names.map((name) => math.derivative(p, name).compile()));
  const gradient: EvalFunction[] = names.map((name) => math.derivative(lagrangian, name).compile());
  return (q: number[], dq: number[], u: number[]): number[] => {
    const scope = scopeOf(mechanism, q, dq);
    const n = names.length;
    const m = new Matrix(n, n);
    const f = new Matrix(n, 1);
    for (let i = 0; i < n; i++) {
      let fi = u[i] + gradient[i].evaluate(scope);
      for (let k = 0; k < n; k++) {
        m.set(i, k, mass[i][k].evaluate(scope));
        fi -= mixed[i][k].evaluate(scope) * dq[k];
      }
      f.set(i, 0, fi);
    }
    return solve(m, f).getColumn(0);
  };
}

/** H = sum_i dq_i dL/d(dq_i) - L, differentiated by mathjs. */
function symbolicHamiltonian(mechanism: Mechanism): (q: number[], dq: number[]) => number {
  const lagrangian = termSum(mechanism.lagrangianTerms);
  const parts = mechanism.coordinates.map((name) => `d${name} * (${math.derivative(lagrangian, `d${name}`).toString()})`);
  const hamiltonian = math.parse(`${parts.join(' + ')} - (${lagrangian.toString()})`).compile();
  return (q, dq) => hamiltonian.evaluate(scopeOf(mechanism, q, dq));
}

function stateAt(recording: SimulatedRecording, k: number) {
  return { q: recording.qExact.map((c) => c[k]), dq: recording.dq.map((c) => c[k]) };
}

function energyAlong(mechanism: Mechanism, recording: SimulatedRecording): Float64Array {
  return Float64Array.from(recording.time, (_, k) => {
    const { q, dq } = stateAt(recording, k);
    return mechanism.energy(q, dq);
  });
}

/** Time of upward zero crossings of a coordinate, by cubic Hermite interpolation of (q, dq) between samples. */
function upwardCrossings(time: Float64Array, q: Float64Array, dq: Float64Array): number[] {
  const crossings: number[] = [];
  for (let k = 1; k < time.length; k++) {
    if (!(q[k - 1] < 0 && q[k] >= 0)) continue;
    const h = time[k] - time[k - 1];
    const at = (s: number) => (2 * s ** 3 - 3 * s ** 2 + 1) * q[k - 1] + (s ** 3 - 2 * s ** 2 + s) * h * dq[k - 1]
      + (-2 * s ** 3 + 3 * s ** 2) * q[k] + (s ** 3 - s ** 2) * h * dq[k];
    let lo = 0, hi = 1;
    for (let i = 0; i < 60; i++) {
      const mid = (lo + hi) / 2;
      if (at(mid) < 0) lo = mid; else hi = mid;
    }
    crossings.push(time[k - 1] + (h * (lo + hi)) / 2);
  }
  return crossings;
}

describe('handbook mechanisms for test data', () => {
  for (const scenario of scenarios) {
    const { mechanism } = scenario;

    describe(`${mechanism.name} (${mechanism.source})`, () => {
      it('its energy terms, read by mathjs, give the same energy as the hand-written energy', () => {
        const energy = termSum(mechanism.energyTerms).compile();
        const uniform = createSeededRandom(11);
        for (let trial = 0; trial < 50; trial++) {
          const { q, dq } = scenario.randomState(uniform);
          const expected = mechanism.energy(q, dq);
          expect(energy.evaluate(scopeOf(mechanism, q, dq))).to.be.closeTo(expected, 1e-12 * (1 + Math.abs(expected)));
        }
      });

      it('the Hamiltonian of its handbook Lagrangian (mathjs derivatives) equals its energy', () => {
        const hamiltonian = symbolicHamiltonian(mechanism);
        const uniform = createSeededRandom(12);
        for (let trial = 0; trial < 50; trial++) {
          const { q, dq } = scenario.randomState(uniform);
          const expected = mechanism.energy(q, dq);
          expect(hamiltonian(q, dq)).to.be.closeTo(expected, 1e-11 * (1 + Math.abs(expected)));
        }
      });

      it('its hand-written accelerations solve the Euler-Lagrange equations of its Lagrangian (mathjs, ml-matrix)', () => {
        const symbolic = symbolicEquationsOfMotion(mechanism);
        const uniform = createSeededRandom(13);
        for (let trial = 0; trial < 50; trial++) {
          const { q, dq } = scenario.randomState(uniform);
          const u = q.map(() => between(uniform, -2, 2));
          const expected = symbolic(q, dq, u);
          const actual = mechanism.accelerations(q, dq, u);
          actual.forEach((a, i) => expect(a).to.be.closeTo(expected[i], 1e-9 * (1 + Math.abs(expected[i]))));
        }
      });

      it('keeps its energy on a passive run (physics: passive conservative motion conserves E)', () => {
        const recording = simulateRecording(mechanism, { initial: scenario.initial, duration: 10, sampleStep: 0.01 });
        const energy = energyAlong(mechanism, recording);
        const scale = Math.max(...energy.map(Math.abs));
        const drift = Math.max(...energy.map((e) => Math.abs(e - energy[0]))) / scale;
        // Integrator tolerance 1e-11; the drift over 10 s stays a small multiple of it.
        expect(drift).to.be.below(1e-9);
      });

      it('balances its energy against the work of the forces along a forced run: dE/dt = sum_i u_i dq_i', () => {
        const sampleStep = 0.001;
        const recording = simulateRecording(mechanism, { initial: scenario.initial, duration: 8, sampleStep, forces: scenario.forces });
        const energy = energyAlong(mechanism, recording);
        const power = Float64Array.from(recording.time, (_, k) =>
          recording.u.reduce((sum, u, i) => sum + u[k] * recording.dq[i][k], 0));
        // Work by composite Simpson over pairs of sample intervals, compared with the energy change.
        let work = 0;
        let worst = 0;
        for (let k = 2; k < recording.time.length; k += 2) {
          work += (sampleStep / 3) * (power[k - 2] + 4 * power[k - 1] + power[k]);
          worst = Math.max(worst, Math.abs(energy[k] - energy[0] - work));
        }
        const change = Math.max(...energy.map((e) => Math.abs(e - energy[0])));
        expect(change).to.be.above(0.05); // the forcing really moved the energy
        expect(worst / change).to.be.below(1e-8);
      });

      it('satisfies dE/dt = sum_i u_i dq_i at single states, with ddq from its accelerations', () => {
        const uniform = createSeededRandom(14);
        for (let trial = 0; trial < 50; trial++) {
          const { q, dq } = scenario.randomState(uniform);
          const u = q.map(() => between(uniform, -2, 2));
          const ddq = mechanism.accelerations(q, dq, u);
          const eps = 1e-6;
          const shifted = (sign: number) => mechanism.energy(
            q.map((v, i) => v + sign * eps * dq[i]), dq.map((v, i) => v + sign * eps * ddq[i]));
          const rate = (shifted(1) - shifted(-1)) / (2 * eps);
          const power = u.reduce((sum, ui, i) => sum + ui * dq[i], 0);
          const scale = 1 + Math.abs(power) + ddq.reduce((s, a, i) => s + Math.abs(a * dq[i]), 0);
          expect(rate).to.be.closeTo(power, 1e-6 * scale);
        }
      });
    });
  }

  it('the simple pendulum swings with period 2 pi sqrt(l/g) at small amplitude (any mechanics handbook)', () => {
    const { l, g } = simplePendulum.parameters;
    const smallPeriod = 2 * Math.PI * Math.sqrt(l / g);
    const amplitude = 1e-3;
    const recording = simulateRecording(simplePendulum, {
      initial: { q: [amplitude], dq: [0] }, duration: 3.2 * smallPeriod, sampleStep: 0.001,
    });
    const crossings = upwardCrossings(recording.time, recording.qExact[0], recording.dq[0]);
    expect(crossings.length).to.be.at.least(3);
    const period = (crossings[2] - crossings[0]) / 2;
    expect(period / smallPeriod).to.be.closeTo(1, 1e-6);
    // Finer: the first amplitude correction, T/T0 = 1 + th0^2/16 + ..., from the series of K in Abramowitz &
    // Stegun 17.3.11 (from memory); measured 1 + 6.240e-8 against 1 + 6.25e-8.
    expect(period / smallPeriod - 1).to.be.closeTo(amplitude ** 2 / 16, 2e-9);
  });

  it('the handbook mechanisms are the four of the checks table', () => {
    expect(handbookMechanisms.map((m) => m.name)).to.deep.equal(
      ['simple pendulum', 'cart with a pole', 'double pendulum', 'spherical pendulum']);
  });

  describe('recordings', () => {
    const simulate = (seed: number) => simulateRecording(simplePendulum, {
      initial: { q: [0.7], dq: [0] }, duration: 20, sampleStep: 0.002, forces: forcesOf(pendulumTorque),
      positionNoise: { sigma: 0.003, seed },
    });

    it('adds Gaussian position noise of the requested size, reproducible by its seed', () => {
      const a = simulate(5);
      const residual = a.q[0].map((v, k) => v - a.qExact[0][k]);
      const n = residual.length;
      const mean = residual.reduce((s, v) => s + v, 0) / n;
      const sd = Math.sqrt(residual.reduce((s, v) => s + (v - mean) ** 2, 0) / (n - 1));
      // Sampling error of a standard deviation from n = 10001 draws is about sd / sqrt(2n) = 0.7 %.
      expect(sd).to.be.closeTo(0.003, 0.003 * 0.03);
      expect(Math.abs(mean)).to.be.below(4 * 0.003 / Math.sqrt(n));
      expect(Array.from(simulate(5).q[0])).to.deep.equal(Array.from(a.q[0]));
      expect(simulate(6).q[0][10]).to.not.equal(a.q[0][10]);
      expect(Array.from(a.dq[0])).to.deep.equal(Array.from(simulate(6).dq[0])); // velocities stay exact
    });

    it('samples at the requested step, with the forces that drove it', () => {
      const a = simulate(5);
      expect(a.time.length).to.equal(10001);
      expect(a.time[10000]).to.be.closeTo(20, 1e-12);
      expect(a.u[0][777]).to.equal(pendulumTorque(a.time[777]));
    });

    it('writes CSV with a header row and every sample, forces as u_<name>', () => {
      const recording = simulateRecording(cartPole, {
        initial: { q: [0, 2.5], dq: [0, 0] }, duration: 1, sampleStep: 0.01, forces: onFirstCoordinate(cartForce, 2),
      });
      const lines = recordingToCsv(recording, cartPole.coordinates, { velocities: true }).trimEnd().split('\n');
      expect(lines[0]).to.equal('time,x,th,dx,dth,u_x');
      expect(lines).to.have.length(102);
      const row = lines[51].split(',').map(Number);
      expect(row).to.deep.equal([recording.time[50], recording.q[0][50], recording.q[1][50], recording.dq[0][50],
        recording.dq[1][50], recording.u[0][50]]);
      expect(recordingToCsv(recording, ['x', 'th']).split('\n')[0]).to.equal('time,x,th,u_x');
    });
  });

  describe('seeded random numbers', () => {
    it('give standard normal deviates (mean 0, variance 1, 95.45 % within two sigma: normal table, from memory)', () => {
      const normal = createNormalRandom(createSeededRandom(2024));
      const n = 200_000;
      let sum = 0, squares = 0, within = 0;
      for (let i = 0; i < n; i++) {
        const x = normal();
        sum += x;
        squares += x * x;
        if (Math.abs(x) < 2) within++;
      }
      expect(sum / n).to.be.closeTo(0, 0.01);
      expect(squares / n).to.be.closeTo(1, 0.01);
      expect(within / n).to.be.closeTo(0.9545, 0.002);
    });
  });
});
