import { expect } from 'chai';
import { prepareTerm } from '../../../shared/math/candidate-term.js';
import { generateTerms } from '../../../shared/math/term-generator.js';
import { TermSymbols } from '../../../shared/math/term-symbols.js';

/** C(n, k), by its product formula (Knuth, TAOCP vol. 1, 1.2.6, from memory). */
function choose(n: number, k: number): number {
  let result = 1;
  for (let i = 1; i <= k; i++) result = (result * (n - k + i)) / i;
  return result;
}

/** The count the generator's doc comment promises: P + T + D + V |F|. */
function documentedCount(n: number, a: number, d: number, v: number, k: number, kinetic = true, trig = true, differences = true): number {
  const p = choose(n + d, d) - 1;
  const t = trig ? 2 * a : 0;
  const dd = differences ? 2 * choose(a, 2) : 0;
  let velocityMonomials = 0;
  for (let j = 2; j <= v; j++) velocityMonomials += choose(n + j - 1, j);
  const factors = kinetic ? 1 + (trig ? 3 * a : 0) + dd + (choose(n + k, k) - 1) : 1;
  return p + t + dd + velocityMonomials * factors;
}

describe('term generator', () => {
  it('generates 8, 38 and 117 terms with the defaults for one, two and three coordinates', () => {
    expect(generateTerms(['th'])).to.have.length(8);
    expect(generateTerms(['a', 'b'])).to.have.length(38);
    expect(generateTerms(['a', 'b', 'c'])).to.have.length(117);
  });

  it('matches the documented count formula across options', () => {
    const cases: [string[], Parameters<typeof generateTerms>[1], number][] = [
      [['x', 'th'], { angles: ['th'] }, documentedCount(2, 1, 2, 2, 0)],
      [['x', 'th'], { angles: ['th'], polynomialDegree: 3, velocityDegree: 4 }, documentedCount(2, 1, 3, 4, 0)],
      [['r', 'th'], { angles: ['th'], kineticPolynomialDegree: 2 }, documentedCount(2, 1, 2, 2, 2)],
      [['a', 'b', 'c'], { kineticFactors: false }, documentedCount(3, 3, 2, 2, 0, false)],
      [['a', 'b'], { trigonometric: false, differences: false }, documentedCount(2, 2, 2, 2, 0, true, false, false)],
      [['a', 'b'], { polynomialDegree: 0 }, documentedCount(2, 2, 0, 2, 0)],
    ];
    for (const [coordinates, options, expected] of cases) {
      expect(generateTerms(coordinates, options), JSON.stringify(options)).to.have.length(expected);
    }
  });

  it('lists the one-coordinate set exactly', () => {
    expect(generateTerms(['th']).map((t) => t.text)).to.deep.equal([
      'th',
      'th^2',
      'sin(th)',
      'cos(th)',
      'dth^2',
      'dth^2*sin(th)',
      'dth^2*cos(th)',
      'dth^2*sin(th)^2',
    ]);
  });

  it('contains the terms of the handbook Lagrangians (Landau & Lifshitz sec. 5 problem 1, Goldstein spherical pendulum, cart-pole)', () => {
    const double = generateTerms(['p1', 'p2']).map((t) => t.text);
    expect(double).to.include.members(['dp1^2', 'dp2^2', 'dp1*dp2*cos(p1 - p2)', 'cos(p1)', 'cos(p2)']);
    const spherical = generateTerms(['th', 'ph']).map((t) => t.text);
    expect(spherical).to.include.members(['dth^2', 'dph^2*sin(th)^2', 'cos(th)']);
    const cart = generateTerms(['x', 'th'], { angles: ['th'] }).map((t) => t.text);
    expect(cart).to.include.members(['dx^2', 'dx*dth*cos(th)', 'dth^2', 'cos(th)']);
    expect(cart).not.to.include('sin(x)');
  });

  it('generates distinct terms that parse, are spelled canonically, and never have velocity degree one', () => {
    const symbols = new TermSymbols(['x', 'th', 'ph']);
    const terms = generateTerms(['x', 'th', 'ph'], { angles: ['th', 'ph'], velocityDegree: 3, kineticPolynomialDegree: 1 });
    const texts = terms.map((t) => t.text);
    expect(new Set(texts).size).to.equal(texts.length);
    for (const { text, family } of terms) {
      const term = prepareTerm(text, symbols);
      expect(term.text, text).to.equal(text);
      expect(term.constant).to.equal(false);
      expect(term.velocityDegree, text).not.to.equal(1);
      expect(term.velocityDegree === 0, text).to.equal(family !== 'kinetic');
    }
  });
});
