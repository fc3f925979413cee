import { expect } from 'chai';
import { all, create } from 'mathjs';
import { createSeededRandom } from '../../../shared/math/seeded-random.js';
import { simplifyTree } from '../../../shared/math/sum-of-products.js';
import { parseExpression } from '../../../shared/math/term-expression.js';
import { formatTerm } from '../../../shared/math/term-format.js';
import { TermSymbols } from '../../../shared/math/term-symbols.js';

// mathjs, a general-purpose library, evaluates the text before and after simplification.
const math = create(all, { number: 'number' });
const symbols = new TermSymbols(['x', 'y']);

function simplified(text: string): string {
  return formatTerm(simplifyTree(parseExpression(text, symbols).tree));
}

describe('sum-of-products simplifier', () => {
  const expressions = [
    '0.3*x*(x + 1)^2 - x^3 + 2*(y - x)*sin(x - y)',
    'x^3/(1 + x) * dx^2 * 0.7 - (dx + x)^2',
    '(sin(x)^2 + cos(x)^2)*dy*dx/(x^2 + 1)^2',
    'cos(y - x)*dx*dy - 1.5*cos(x - y)*dy*dx + sin(y - x)',
    '-(-(x)) * 4 / 0.1 - x/(2*y)',
    '(x + y)^5 - (x - y)^-2 + 1e-7*x',
  ];
  for (const text of expressions) {
    it(`computes the same function after simplifying ${text}`, () => {
      const after = simplified(text);
      const random = createSeededRandom(5);
      for (let k = 0; k < 25; k++) {
        const scope = { x: 2 * random() - 1, y: 2 * random() + 2, dx: 4 * random() - 2, dy: 4 * random() - 2 };
        const before = math.evaluate(text, { ...scope }) as number;
        const value = math.evaluate(after, { ...scope }) as number;
        expect(Math.abs(value - before), `${after} at ${JSON.stringify(scope)}`).to.be.below(1e-12 * Math.max(1, Math.abs(before)));
      }
    });
  }

  it('collects like products and drops exact cancellations', () => {
    expect(simplified('x*dy*2 - dy*x*2 + 3*x')).to.equal('3*x');
    expect(simplified('x*(1 - 0)*1 + 0*y')).to.equal('x');
  });

  it('treats sin of a reversed difference as minus sin, cos as the same', () => {
    expect(simplified('sin(y - x) + sin(x - y)')).to.equal('0');
    expect(simplified('cos(y - x) - cos(x - y)')).to.equal('0');
    expect(simplified('sin(y - x)')).to.equal('-sin(x - y)');
  });

  it('keeps a denominator as a power of its sum instead of expanding it', () => {
    expect(simplified('x/(x + 1)^2')).to.equal('x/(x + 1)^2');
  });

  it('writes a negative leading coefficient into its number and keeps the leading symbols first', () => {
    const tree = parseExpression('-2*x*dx + y', symbols).tree;
    expect(formatTerm(simplifyTree(tree))).to.equal('-2*dx*x + y');
    expect(formatTerm(simplifyTree(tree, ['y']))).to.equal('y - 2*dx*x');
  });
});
