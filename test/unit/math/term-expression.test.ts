import { expect } from 'chai';
import { create, all } from 'mathjs';
import { prepareTerm } from '../../../shared/math/candidate-term.js';
import { DiscoveryInputError } from '../../../shared/math/discovery-input-error.js';
import { sampleColumns } from '../../../shared/math/term-compiler.js';
import { partialDerivative } from '../../../shared/math/term-derivative.js';
import { parseExpression, TermError } from '../../../shared/math/term-expression.js';
import { formatTerm } from '../../../shared/math/term-format.js';
import { compileTerm } from '../../../shared/math/term-compiler.js';
import { TermSymbols } from '../../../shared/math/term-symbols.js';

const symbols = new TermSymbols(['th', 'ph']);
/** A few states of (th, ph, dth, dph, ddth, ddph), away from singular points. */
const states = [
  { th: 0.3, ph: -0.2, dth: 1.5, dph: 0.7, ddth: 2.0, ddph: -1.0 },
  { th: -1.1, ph: 2.4, dth: -0.4, dph: 3.1, ddth: -0.5, ddph: 0.25 },
  { th: 2.9, ph: 0.05, dth: 0.8, dph: -2.2, ddth: 1.7, ddph: 4.0 },
];
const columns = sampleColumns(
  Object.fromEntries(Object.keys(states[0]!).map((k) => [k, Float64Array.from(states, (s) => s[k as keyof typeof s])])),
  states.length,
);

function refusal(text: string, names = new TermSymbols(['th', 'ph'])): string {
  try {
    prepareTerm(text, names);
  } catch (error) {
    expect(error).to.be.instanceOf(TermError);
    return (error as Error).message;
  }
  throw new Error(`"${text}" was accepted`);
}

describe('term expressions', () => {
  describe('whitelist', () => {
    it('accepts numbers, symbols, + - * / ^ with whole exponents, unary minus, sin and cos', () => {
      for (const text of ['dth^2', '-cos(th)', '2 th', 'dth*dph*cos(th - ph)', 'th^(-2)', '(dth + th)^3/4', 'sin(2*th)', '+th']) {
        expect(() => prepareTerm(text, symbols), text).not.to.throw();
      }
    });

    it('refuses unknown symbols and names the term and the symbol', () => {
      const message = refusal('dth^2*cos(x)');
      expect(message).to.contain('"dth^2*cos(x)"').and.to.contain('unknown symbol "x"');
    });

    it('refuses constants of the notation such as pi and units such as cm as unknown symbols', () => {
      expect(refusal('cos(th + pi)')).to.contain('unknown symbol "pi"');
      expect(refusal('2 cm')).to.contain('unknown symbol "cm"');
    });

    it('refuses functions other than sin and cos', () => {
      expect(refusal('exp(th)')).to.contain('"exp(th)"').and.to.contain('function exp is not allowed');
      expect(refusal('sqrt(dth)')).to.contain('function sqrt');
      expect(refusal('evaluate("1+1")')).to.contain('function evaluate');
      expect(refusal('import(th)')).to.contain('function import');
    });

    it('refuses non-integer and symbolic exponents', () => {
      expect(refusal('th^0.5')).to.contain('whole number');
      expect(refusal('th^dth')).to.contain('whole number');
    });

    it('refuses assignments, matrices, strings, comparisons, factorials and property access', () => {
      for (const text of ['th = 3', '[th, ph]', '"th"', 'th == ph', 'th!', 'th.constructor', 'f(x) = x', 'th ? 1 : 2']) {
        const message = refusal(text);
        expect(message, text).to.contain(`"${text}"`);
      }
    });

    it('refuses malformed and empty text with the term named', () => {
      expect(refusal('dth^2 +')).to.contain('"dth^2 +"').and.to.contain('not a valid expression');
      expect(refusal('  ')).to.contain('empty');
    });

    it('refuses accelerations in energy terms', () => {
      expect(refusal('ddth*th')).to.contain('"ddth" is an acceleration');
    });
  });

  describe('coordinate names', () => {
    it('refuses names that collide with constants, functions, keywords or another coordinate\'s velocity', () => {
      for (const [coordinates, fragment] of [
        [['e'], 'constant'],
        [['pi'], 'constant'],
        [['i'], 'constant'],
        [['sin'], 'function'],
        [['true'], 'keyword'],
        [['x', 'dx'], 'velocity of coordinate "x"'],
        [['x', 'ddx'], 'acceleration of coordinate "x"'],
        [['2x'], 'not usable'],
        [['x', 'x'], 'twice'],
      ] as [string[], string][]) {
        expect(() => new TermSymbols(coordinates), coordinates.join(',')).to.throw(DiscoveryInputError, fragment);
      }
    });
  });

  describe('symbolic derivatives', () => {
    // Hand-derived partial derivatives (elementary calculus, from memory).
    const handDerived: [string, string, (s: (typeof states)[number]) => number][] = [
      ['dth^2*cos(th)', 'th', (s) => -(s.dth ** 2) * Math.sin(s.th)],
      ['dth^2*cos(th)', 'dth', (s) => 2 * s.dth * Math.cos(s.th)],
      ['dph^2*sin(th)^2', 'th', (s) => 2 * s.dph ** 2 * Math.sin(s.th) * Math.cos(s.th)],
      ['dth*dph*cos(th - ph)', 'ph', (s) => s.dth * s.dph * Math.sin(s.th - s.ph)],
      ['dth*dph*cos(th - ph)', 'dth', (s) => s.dph * Math.cos(s.th - s.ph)],
      ['th^(-2)', 'th', (s) => -2 / s.th ** 3],
      ['th/ph', 'ph', (s) => -s.th / s.ph ** 2],
      ['0.1*th^3/3', 'th', (s) => 0.1 * s.th ** 2],
      ['-sin(2*th)', 'th', (s) => -2 * Math.cos(2 * s.th)],
    ];
    for (const [text, symbol, expected] of handDerived) {
      it(`d(${text})/d${symbol} matches the hand-derived derivative`, () => {
        const derivative = compileTerm(partialDerivative(parseExpression(text, symbols), symbol, symbols))(columns);
        states.forEach((s, k) => expect(derivative[k]).to.be.closeTo(expected(s), 1e-12 * (1 + Math.abs(expected(s)))));
      });
    }

    it('matches a five-point finite difference for every symbol of generated-style terms', () => {
      // Five-point central difference f' = (f(-2h) - 8 f(-h) + 8 f(h) - f(2h)) / 12h, Abramowitz & Stegun 25.3.6 (from memory).
      const h = 1e-3;
      const texts = ['dth^2*sin(ph)^2', 'dth*dph*cos(th - ph)', '(dth + th)^3/(1 + ph^2)', 'th^2*ph - cos(ph)*dph^4'];
      for (const text of texts) {
        const expression = parseExpression(text, symbols);
        const value = compileTerm(expression.tree);
        for (const symbol of ['th', 'ph', 'dth', 'dph']) {
          const symbolic = compileTerm(partialDerivative(expression, symbol, symbols))(columns);
          states.forEach((s, k) => {
            const at = (offset: number) =>
              value(sampleColumns(Object.fromEntries(Object.entries(s).map(([n, v]) => [n, Float64Array.of(n === symbol ? v + offset : v)])), 1))[0]!;
            const numeric = (at(-2 * h) - 8 * at(-h) + 8 * at(h) - at(2 * h)) / (12 * h);
            expect(symbolic[k], `${text} by ${symbol}`).to.be.closeTo(numeric, 1e-7 * (1 + Math.abs(numeric)));
          });
        }
      }
    });

    it('gives the chain-rule time derivative sum (dT/dq) dq + (dT/ddq) ddq', () => {
      // d/dt [dth^2 cos th] = 2 dth ddth cos th - dth^3 sin th, by hand.
      const term = prepareTerm('dth^2*cos(th)', symbols);
      const rate = term.timeDerivative(columns);
      states.forEach((s, k) =>
        expect(rate[k]).to.be.closeTo(2 * s.dth * s.ddth * Math.cos(s.th) - s.dth ** 3 * Math.sin(s.th), 1e-12),
      );
    });

    it('marks terms whose every partial derivative simplifies to zero as constant', () => {
      expect(prepareTerm('sin(th)^2 + cos(th)^2', symbols).constant).to.equal(true);
      expect(prepareTerm('th/th', symbols).constant).to.equal(true);
      expect(prepareTerm('sin(th)^2', symbols).constant).to.equal(false);
    });
  });

  describe('printing and compiling', () => {
    // mathjs, a general-purpose library, evaluates the printed text independently of our compiler.
    const math = create(all, { number: 'number' });
    const texts = ['dth^2*cos(th)', '-th^2', '(-th)^3', 'th - (ph - dth)', 'th/(ph*dth)', 'th^(-2)*dph', '-(th + ph)*dth', '2 th', '1e-7*dth^2'];
    for (const text of texts) {
      it(`prints "${text}" so that it parses back to the same value and the same text`, () => {
        const tree = parseExpression(text, symbols).tree;
        const printed = formatTerm(tree);
        expect(formatTerm(parseExpression(printed, symbols).tree)).to.equal(printed);
        const ours = compileTerm(tree)(columns);
        states.forEach((s, k) => {
          const reference = math.evaluate(text, { ...s }) as number;
          expect(ours[k], printed).to.be.closeTo(reference, 1e-13 * (1 + Math.abs(reference)));
          expect(math.evaluate(printed, { ...s }) as number).to.be.closeTo(reference, 1e-13 * (1 + Math.abs(reference)));
        });
      });
    }

    it('keeps numbers at full double precision in printed text', () => {
      expect(formatTerm(parseExpression('0.1234567890123456789*th', symbols).tree)).to.equal(`${0.1234567890123456789}*th`);
    });
  });
});
