import type { TermTree } from '../math/term-tree.js';

/** What differs between the languages code is generated for. */
export interface CodeDialect {
  /** A non-negative number literal that reads back as the same double. */
  number(value: number): string;
  sin: string;
  cos: string;
  /** Name of the generated integer-power helper (repeated squaring, as point-compiler.ts computes). */
  integerPower: string;
}

/** Numbers as String(x) (every digit), with `.0` added where a language would read a whole number as an integer. */
export function floatLiteral(value: number): string {
  const text = String(value);
  return /[.eE]/.test(text) || !Number.isFinite(value) ? text : `${text}.0`;
}

const precedence = { add: 1, subtract: 1, multiply: 2, divide: 2, unary: 3, atom: 5 } as const;

interface Printed {
  text: string;
  precedence: number;
}

/**
 * Source code computing a tree, for C, TypeScript or Python (all share + - * / and unary minus with the usual
 * precedence). `symbol` says how to read a symbol (`q[0]`, `dq[1]`, `u[0]`). The operations are the tree's
 * own, in its order, so the generated code computes the same numbers as our compiled trees up to the last bits
 * of sin and cos of the platform's math library: integer powers call a helper that repeats point-compiler.ts's
 * squaring, a square of a plain variable is written `x*x`, which is the same product.
 */
export function expressionCode(tree: TermTree, dialect: CodeDialect, symbol: (name: string) => string): string {
  return print(tree, dialect, symbol).text;
}

function print(tree: TermTree, dialect: CodeDialect, symbol: (name: string) => string): Printed {
  const recurse = (t: TermTree) => print(t, dialect, symbol);
  switch (tree.kind) {
    case 'number':
      return tree.value < 0 || Object.is(tree.value, -0)
        ? { text: `-${dialect.number(-tree.value)}`, precedence: precedence.unary }
        : { text: dialect.number(tree.value), precedence: precedence.atom };
    case 'symbol':
      return { text: symbol(tree.name), precedence: precedence.atom };
    case 'sin':
    case 'cos':
      return { text: `${tree.kind === 'sin' ? dialect.sin : dialect.cos}(${recurse(tree.arg).text})`, precedence: precedence.atom };
    case 'negate': {
      const arg = recurse(tree.arg);
      // Parenthesize anything that is not an atom, so `-(-x)` never prints as `--x` (a decrement in C).
      return { text: `-${arg.precedence === precedence.atom ? arg.text : `(${arg.text})`}`, precedence: precedence.unary };
    }
    case 'power': {
      const base = recurse(tree.base);
      if (tree.exponent === 2 && tree.base.kind === 'symbol') return { text: `(${base.text}*${base.text})`, precedence: precedence.atom };
      return { text: `${dialect.integerPower}(${base.text}, ${tree.exponent})`, precedence: precedence.atom };
    }
    default: {
      const own = precedence[tree.kind];
      const left = recurse(tree.left);
      const right = recurse(tree.right);
      const leftText = left.precedence < own ? `(${left.text})` : left.text;
      // Same precedence on the right needs parentheses (a - (b - c), a / (b * c)); so does any unary minus.
      const rightText = right.precedence <= own || right.precedence === precedence.unary ? `(${right.text})` : right.text;
      const operator = { add: ' + ', subtract: ' - ', multiply: '*', divide: '/' }[tree.kind];
      return { text: `${leftText}${operator}${rightText}`, precedence: own };
    }
  }
}
