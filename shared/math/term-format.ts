import type { TermTree } from './term-tree.js';

/** How tightly each operation binds when printed, loosest first; numbers, symbols and functions are atoms. */
export const termPrecedence = {
  add: 1,
  subtract: 1,
  multiply: 2,
  divide: 2,
  negate: 3,
  power: 4,
  atom: 5,
} as const;

/** The binding of a tree's outermost operation; a negative number binds like a negation. */
export function precedenceOf(tree: TermTree): number {
  switch (tree.kind) {
    case 'number':
      return tree.value < 0 || Object.is(tree.value, -0) ? termPrecedence.negate : termPrecedence.atom;
    case 'symbol':
    case 'sin':
    case 'cos':
      return termPrecedence.atom;
    default:
      return termPrecedence[tree.kind];
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
      return `-${wrap(tree.arg, precedenceOf(tree.arg) < termPrecedence.power)}`;
    case 'power': {
      const exponent = tree.exponent < 0 ? `(${tree.exponent})` : String(tree.exponent);
      return `${wrap(tree.base, precedenceOf(tree.base) <= termPrecedence.power)}^${exponent}`;
    }
    default: {
      const own = termPrecedence[tree.kind];
      const left = wrap(tree.left, precedenceOf(tree.left) < own);
      const right = wrap(tree.right, precedenceOf(tree.right) <= own || precedenceOf(tree.right) === termPrecedence.negate);
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
  return precedenceOf(tree) < termPrecedence.multiply || precedenceOf(tree) === termPrecedence.negate;
}
