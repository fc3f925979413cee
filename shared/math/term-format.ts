import type { TermTree } from './term-tree.js';

const precedence = {
  add: 1,
  subtract: 1,
  multiply: 2,
  divide: 2,
  negate: 3,
  power: 4,
  atom: 5,
} as const;

function precedenceOf(tree: TermTree): number {
  switch (tree.kind) {
    case 'number':
      return tree.value < 0 || Object.is(tree.value, -0) ? precedence.negate : precedence.atom;
    case 'symbol':
    case 'sin':
    case 'cos':
      return precedence.atom;
    default:
      return precedence[tree.kind];
  }
}

/**
 * Prints a tree in the notation users type (`dth^2*cos(th)`, `sin(x - y)`), with only the parentheses the
 * structure needs and numbers as String(x), which round-trips every double. Parsing the output gives back the
 * same tree, so printed text can serve as a term's canonical spelling.
 */
export function formatTerm(tree: TermTree): string {
  switch (tree.kind) {
    case 'number':
      return String(tree.value);
    case 'symbol':
      return tree.name;
    case 'sin':
    case 'cos':
      return `${tree.kind}(${formatTerm(tree.arg)})`;
    case 'negate':
      return `-${wrap(tree.arg, precedenceOf(tree.arg) < precedence.power)}`;
    case 'power': {
      const exponent = tree.exponent < 0 ? `(${tree.exponent})` : String(tree.exponent);
      return `${wrap(tree.base, precedenceOf(tree.base) <= precedence.power)}^${exponent}`;
    }
    default: {
      const own = precedence[tree.kind];
      const left = wrap(tree.left, precedenceOf(tree.left) < own);
      const right = wrap(tree.right, precedenceOf(tree.right) <= own || precedenceOf(tree.right) === precedence.negate);
      const symbol = { add: ' + ', subtract: ' - ', multiply: '*', divide: '/' }[tree.kind];
      return `${left}${symbol}${right}`;
    }
  }
}

function wrap(tree: TermTree, parenthesize: boolean): string {
  const text = formatTerm(tree);
  return parenthesize ? `(${text})` : text;
}

/** True when the printed term needs parentheses to be multiplied by a coefficient (`c*(x + y)`). */
export function needsParenthesesAsFactor(tree: TermTree): boolean {
  return precedenceOf(tree) < precedence.multiply || precedenceOf(tree) === precedence.negate;
}
