import { expect } from 'chai';
import { all, create } from 'mathjs';
import { DiscoveryInputError } from '../../../shared/math/discovery-input-error.js';
import { deriveEquationsOfMotion, type EquationsOfMotion } from '../../../shared/math/euler-lagrange.js';
import { compileModelDynamics } from '../../../shared/math/model-dynamics.js';
import { cartPole, doublePendulum, simplePendulum, sphericalPendulum } from '../../support/mechanisms/handbook-mechanisms.js';
import type { Mechanism } from '../../support/mechanisms/mechanism.js';
import { randomStates, type State } from './random-states.js';

// A general-purpose library (mathjs, not our compiler) evaluates the printed equations in the printing check.
const math = create(all, { number: 'number' });

function equationsOf(mechanism: Mechanism): EquationsOfMotion {
  const terms = Object.entries(mechanism.lagrangianTerms).map(([term, coefficient]) => ({ term, coefficient }));
  return deriveEquationsOfMotion(mechanism.coordinates, terms);
}

/** Random states in a box; `first` keeps the spherical pendulum off its coordinate pole. */
function sampleStates(n: number, count: number, seed: number, first: [number, number] = [-3, 3]): State[] {
  return randomStates(n, count, seed, { first, q: 3, dq: 5, u: 2 });
}

function relativeDifference(a: number, b: number): number {
  return Math.abs(a - b) / Math.max(1, Math.abs(b));
}

describe('equations of motion from a Lagrangian (Euler-Lagrange)', () => {
  const cases: { mechanism: Mechanism; q0Range?: [number, number] }[] = [
    { mechanism: doublePendulum },
    { mechanism: cartPole },
    { mechanism: sphericalPendulum, q0Range: [0.3, 2.8] },
    { mechanism: simplePendulum },
  ];
  for (const { mechanism, q0Range } of cases) {
    it(`gives the handbook accelerations of the ${mechanism.name} on 200 sampled states to 1e-10 (${mechanism.source})`, () => {
      const dynamics = compileModelDynamics(equationsOf(mechanism));
      const ddq = new Float64Array(mechanism.coordinates.length);
      let worst = 0;
      for (const s of sampleStates(mechanism.coordinates.length, 200, 7, q0Range)) {
        expect(dynamics.accelerations(s.q, s.dq, s.u, ddq)).to.be.above(0);
        const expected = mechanism.accelerations(s.q, s.dq, s.u);
        expected.forEach((e, i) => (worst = Math.max(worst, relativeDifference(ddq[i]!, e))));
      }
      expect(worst).to.be.below(1e-10);
    });
  }

  it('gives the mass matrix and force vector written in Landau & Lifshitz, Mechanics, sec. 5, problem 1 (double pendulum)', () => {
    const { m1, m2, l1, l2, g } = doublePendulum.parameters as Record<string, number>;
    const dynamics = compileModelDynamics(equationsOf(doublePendulum));
    const matrix = new Float64Array(4);
    const force = new Float64Array(2);
    for (const { q, dq, u } of sampleStates(2, 50, 11)) {
      const d = q[0]! - q[1]!;
      // (m1+m2) l1^2 ddth1 + m2 l1 l2 cos d ddth2 = u1 - m2 l1 l2 sin d dth2^2 - (m1+m2) g l1 sin th1, and the second row.
      const expectedMatrix = [(m1! + m2!) * l1! * l1!, m2! * l1! * l2! * Math.cos(d), m2! * l1! * l2! * Math.cos(d), m2! * l2! * l2!];
      const expectedForce = [
        u[0]! - m2! * l1! * l2! * Math.sin(d) * dq[1]! ** 2 - (m1! + m2!) * g! * l1! * Math.sin(q[0]!),
        u[1]! + m2! * l1! * l2! * Math.sin(d) * dq[0]! ** 2 - m2! * g! * l2! * Math.sin(q[1]!),
      ];
      dynamics.massMatrix(q, dq, matrix);
      dynamics.forceVector(q, dq, u, force);
      expectedMatrix.forEach((e, k) => expect(relativeDifference(matrix[k]!, e)).to.be.below(1e-14));
      expectedForce.forEach((e, i) => expect(relativeDifference(force[i]!, e)).to.be.below(1e-13));
    }
  });

  it('collects the cart with a pole into the textbook form: f_th = u_th + m g l sin th, with no cart velocity left', () => {
    // Control textbooks' cart-pole equations (th from upright): m l cos th ddx + m l^2 ddth - m g l sin th = u_th.
    const { m, l, g } = cartPole.parameters as Record<string, number>;
    const equations = equationsOf(cartPole);
    expect(equations.forceVectorText[1]).to.equal(`u_th + ${m! * g! * l!}*sin(th)`);
    // and (M+m) ddx + m l cos th ddth - m l sin th dth^2 = u_x.
    expect(equations.forceVectorText[0]).to.equal(`u_x + ${m! * l!}*dth^2*sin(th)`);
    expect(equations.massMatrixText[0]![1]).to.equal(`${m! * l!}*cos(th)`);
  });

  it('keeps every digit of a coefficient (2 c for c dth^2, no nearby fraction)', () => {
    const c = 0.123456789012345;
    const equations = deriveEquationsOfMotion(['th'], [
      { term: 'dth^2', coefficient: c },
      { term: 'cos(th)', coefficient: 1.1 },
    ]);
    expect(equations.massMatrixText[0]![0]).to.equal(String(2 * c));
    expect(equations.forceVectorText[0]).to.equal('u_th - 1.1*sin(th)');
  });

  it('prints equations that a general-purpose evaluator (mathjs) reads back to the same numbers', () => {
    for (const mechanism of [doublePendulum, cartPole, sphericalPendulum]) {
      const equations = equationsOf(mechanism);
      const dynamics = compileModelDynamics(equations);
      const n = mechanism.coordinates.length;
      const matrix = new Float64Array(n * n);
      const force = new Float64Array(n);
      for (const { q, dq, u } of sampleStates(n, 20, 3, [0.3, 2.8])) {
        const scope: Record<string, number> = {};
        mechanism.coordinates.forEach((c, i) => {
          scope[c] = q[i]!;
          scope[`d${c}`] = dq[i]!;
          scope[equations.forceSymbols[i]!] = u[i]!;
        });
        dynamics.massMatrix(q, dq, matrix);
        dynamics.forceVector(q, dq, u, force);
        equations.massMatrixText.flat().forEach((text, k) => expect(relativeDifference(math.evaluate(text, { ...scope }), matrix[k]!)).to.be.below(1e-14));
        equations.forceVectorText.forEach((text, i) => expect(relativeDifference(math.evaluate(text, { ...scope }), force[i]!)).to.be.below(1e-13));
      }
    }
  });

  it('gives a symmetric mass matrix and writes the generalized force first in each row of f', () => {
    const equations = equationsOf(doublePendulum);
    expect(equations.massMatrixText[0]![1]).to.equal(equations.massMatrixText[1]![0]);
    expect(equations.forceVectorText.map((f) => f.split(' ')[0])).to.deep.equal(['u_th1', 'u_th2']);
  });

  it('leaves out terms with a null coefficient and lists them', () => {
    const equations = deriveEquationsOfMotion(['x'], [
      { term: 'dx^2', coefficient: 0.5 },
      { term: 'x*dx', coefficient: null },
    ]);
    expect(equations.leftOut).to.deep.equal(['x*dx']);
    expect(equations.forceVectorText).to.deep.equal(['u_x']);
  });

  it('keeps velocity-dependent inertia (dx^4 makes M depend on dx) and gyroscopic terms of degree one', () => {
    // L = a dx^4 + b x dy: M_xx = 12 a dx^2; f_x = u_x + b dy, f_y = u_y - b dx (d/dt of b x is b dx).
    const equations = deriveEquationsOfMotion(['x', 'y'], [
      { term: 'dx^4', coefficient: 0.25 },
      { term: 'dy^2', coefficient: 0.5 },
      { term: 'x*dy', coefficient: 2 },
    ]);
    expect(equations.massMatrixText).to.deep.equal([['3*dx^2', '0'], ['0', '1']]);
    expect(equations.forceVectorText).to.deep.equal(['u_x + 2*dy', 'u_y - 2*dx']);
  });

  it('refuses a coordinate whose name is another coordinate\'s force symbol', () => {
    expect(() => deriveEquationsOfMotion(['x', 'u_x'], [{ term: 'dx^2', coefficient: 1 }])).to.throw(DiscoveryInputError, 'u_x');
  });

  it('refuses a term outside the whitelist, naming it', () => {
    expect(() => deriveEquationsOfMotion(['x'], [{ term: 'exp(x)', coefficient: 1 }])).to.throw(DiscoveryInputError, 'exp(x)');
  });
});
