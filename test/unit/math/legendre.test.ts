import { expect } from 'chai';
import { prepareTerm } from '../../../shared/math/candidate-term.js';
import { formatEnergy } from '../../../shared/math/energy-expression.js';
import { lagrangianFromEnergy } from '../../../shared/math/legendre.js';
import type { RecordingSignals } from '../../../shared/math/recording-signals.js';
import { sampleColumns } from '../../../shared/math/term-compiler.js';
import { TermSymbols } from '../../../shared/math/term-symbols.js';

const symbols = new TermSymbols(['th', 'ph']);

/** States spread over the plane (not a trajectory: the Legendre step is pointwise). */
function samples(count: number): RecordingSignals {
  const column = (f: (k: number) => number) => Float64Array.from({ length: count }, (_, k) => f(k));
  const data = {
    th: column((k) => Math.sin(0.37 * k) * 1.2),
    ph: column((k) => Math.cos(0.11 * k) * 2.0),
    dth: column((k) => Math.cos(0.23 * k + 0.4) * 3.0),
    dph: column((k) => Math.sin(0.53 * k + 1.0) * 2.5),
  };
  return { name: 'states', role: 'train', time: column((k) => k), samples: sampleColumns(data, count), power: null, length: count };
}

// The rule under test: H = sum_i dq_i dL/ddq_i - L (Legendre transform, any mechanics handbook, e.g. Goldstein ch. 8),
// so a term homogeneous of degree p in the velocities enters H with (p - 1) times its Lagrangian coefficient.
describe('Legendre step (energy to Lagrangian)', () => {
  it('turns the pendulum energy into its handbook Lagrangian: kinetic terms keep their sign, potential terms flip', () => {
    // Pendulum of our own parameters m = 0.9 kg, l = 0.4 m, g0 = 9.80665 m/s^2:
    // E = m l^2/2 dth^2 - m g l cos th, L = m l^2/2 dth^2 + m g l cos th (Landau & Lifshitz, Mechanics, sec. 5).
    const m = 0.9, l = 0.4, g = 9.80665;
    const terms = ['dth^2', 'cos(th)'].map((t) => prepareTerm(t, symbols));
    const result = lagrangianFromEnergy(terms, [(m * l * l) / 2, -m * g * l], [samples(50)]);
    expect(result.coefficients[0]).to.be.closeTo((m * l * l) / 2, 1e-14);
    expect(result.coefficients[1]).to.be.closeTo(m * g * l, 1e-13);
    expect(result.notIdentifiable).to.deep.equal([]);
    expect(result.relativeResidual).to.be.below(1e-14);
  });

  it('divides a term of velocity degree p by p - 1 (degree 4: by 3; degree 3: by 2)', () => {
    const terms = ['dth^4*cos(ph)', 'dth*dph^2', 'th^2'].map((t) => prepareTerm(t, symbols));
    const result = lagrangianFromEnergy(terms, [0.6, 0.8, 1.5], [samples(60)]);
    expect(result.coefficients[0]).to.be.closeTo(0.2, 1e-13);
    expect(result.coefficients[1]).to.be.closeTo(0.4, 1e-13);
    expect(result.coefficients[2]).to.be.closeTo(-1.5, 1e-13);
  });

  it('flags terms of velocity degree one as not identifiable and leaves them out of the Lagrangian', () => {
    const terms = ['dth^2', 'th*dph', 'cos(ph)'].map((t) => prepareTerm(t, symbols));
    const result = lagrangianFromEnergy(terms, [0.5, 0.3, -2], [samples(40)]);
    expect(result.notIdentifiable).to.deep.equal(['th*dph']);
    expect(result.coefficients[1]).to.equal(null);
    expect(formatEnergy(terms, result.coefficients)).not.to.contain('dph');
    // The energy's degree-one part cannot come from any Lagrangian over these terms: the step says so.
    expect(result.relativeResidual).to.be.above(1e-3);
  });

  it('solves by least squares when a term mixes degrees, which sign rules alone cannot do', () => {
    // Term A = dth^2 + cos(th) has bracket dth^2 - cos(th); term B = cos(th) has bracket -cos(th) (by hand).
    // E = a A + b B = a dth^2 + (a + b) cos(th) is matched by d_A = a, d_B = -2a - b.
    const terms = ['dth^2 + cos(th)', 'cos(th)'].map((t) => prepareTerm(t, symbols));
    const a = 0.7, b = -3.1;
    const result = lagrangianFromEnergy(terms, [a, b], [samples(80)]);
    expect(terms[0]!.velocityDegree).to.equal(null);
    expect(result.coefficients[0]).to.be.closeTo(a, 1e-13);
    expect(result.coefficients[1]).to.be.closeTo(-2 * a - b, 1e-13);
    expect(result.relativeResidual).to.be.below(1e-13);
  });
});
