import { precedenceOf, termPrecedence } from '../math/term-format.js';
import type { TermTree } from '../math/term-tree.js';

/*
 * Expression trees as LaTeX math: coordinates by name (Greek names as letters, trailing digits as subscripts),
 * velocities with a dot, accelerations with two, the force on a coordinate as u with the coordinate as index.
 * Numbers keep every digit (String(x)), an exponent written as a power of ten.
 */

const greek = [
  'alpha', 'beta', 'gamma', 'delta', 'epsilon', 'zeta', 'eta', 'theta', 'iota', 'kappa', 'lambda', 'mu', 'nu',
  'xi', 'rho', 'sigma', 'upsilon', 'chi', 'psi', 'omega', 'Gamma', 'Delta', 'Theta', 'Lambda', 'Xi', 'Sigma',
  'Upsilon', 'Psi', 'Omega',
];
/** Short spellings of angles that are common in mechanism descriptions. */
const abbreviations: Record<string, string> = { th: '\\theta', ph: '\\varphi', ps: '\\psi', al: '\\alpha', be: '\\beta', ga: '\\gamma' };

/** LaTeX of a coordinate name: `th1` is theta with index 1, `x_cart` is x with index cart, `arm` is upright arm. */
export function coordinateLatex(name: string): string {
  const underscore = name.indexOf('_');
  if (underscore > 0) return `${baseLatex(name.slice(0, underscore))}_{${identifierLatex(name.slice(underscore + 1))}}`;
  const match = /^(.*?)(\d+)$/.exec(name);
  if (match && match[1]) return `${baseLatex(match[1])}_{${match[2]}}`;
  return baseLatex(name);
}

function baseLatex(name: string): string {
  if (greek.includes(name)) return `\\${name}`;
  if (abbreviations[name]) return abbreviations[name]!;
  return identifierLatex(name);
}

function identifierLatex(text: string): string {
  const escaped = text.replace(/_/g, '\\_');
  return text.length === 1 ? escaped : `\\mathrm{${escaped}}`;
}

/** How the symbols of an expression print: coordinate i, its velocity, its acceleration, its force. */
export function symbolLatexTable(coordinates: readonly string[], forceSymbols: readonly string[]): Map<string, string> {
  const table = new Map<string, string>();
  coordinates.forEach((c, i) => {
    const base = coordinateLatex(c);
    // The dot goes over the letter, not over its index: \dot{\theta}_{1}.
    const [letter, index] = splitIndex(base);
    table.set(c, base);
    table.set(`d${c}`, `\\dot{${letter}}${index}`);
    table.set(`dd${c}`, `\\ddot{${letter}}${index}`);
    table.set(forceSymbols[i]!, `u_{${base}}`);
  });
  return table;
}

function splitIndex(latex: string): [string, string] {
  const at = latex.indexOf('_{');
  return at < 0 ? [latex, ''] : [latex.slice(0, at), latex.slice(at)];
}

/** A number with every digit; `1.5e-7` becomes `1.5 \cdot 10^{-7}`. */
export function numberLatex(value: number): string {
  const text = String(value);
  const match = /^(-?[\d.]+)e([+-]\d+)$/.exec(text);
  if (!match) return text;
  return `${match[1]} \\cdot 10^{${Number(match[2])}}`;
}

/** LaTeX of a tree, with symbols printed through `symbols` (symbolLatexTable); unknown names print as they are. */
export function termLatex(tree: TermTree, symbols: ReadonlyMap<string, string>): string {
  const recurse = (t: TermTree) => termLatex(t, symbols);
  const wrap = (t: TermTree, parenthesize: boolean) => (parenthesize ? `\\left(${recurse(t)}\\right)` : recurse(t));
  switch (tree.kind) {
    case 'number':
      return numberLatex(tree.value);
    case 'symbol':
      return symbols.get(tree.name) ?? identifierLatex(tree.name);
    case 'sin':
    case 'cos':
      return `\\${tree.kind}\\left(${recurse(tree.arg)}\\right)`;
    case 'negate':
      return `-${wrap(tree.arg, precedenceOf(tree.arg) < termPrecedence.multiply)}`;
    case 'power': {
      if (tree.base.kind === 'sin' || tree.base.kind === 'cos') {
        return `\\${tree.base.kind}^{${tree.exponent}}\\left(${recurse(tree.base.arg)}\\right)`;
      }
      return `${wrap(tree.base, precedenceOf(tree.base) <= termPrecedence.power)}^{${tree.exponent}}`;
    }
    case 'divide':
      return `\\frac{${recurse(tree.left)}}{${recurse(tree.right)}}`;
    case 'multiply': {
      const left = wrap(tree.left, precedenceOf(tree.left) < termPrecedence.multiply);
      const right = wrap(tree.right, precedenceOf(tree.right) <= termPrecedence.multiply || precedenceOf(tree.right) === termPrecedence.negate);
      // A number on the right would run into the one before it: write the product sign there.
      const sign = startsWithDigit(right) ? ' \\cdot ' : ' \\, ';
      return `${left}${sign}${right}`;
    }
    case 'add':
    case 'subtract': {
      const left = recurse(tree.left);
      const right = wrap(tree.right, precedenceOf(tree.right) <= termPrecedence.add || precedenceOf(tree.right) === termPrecedence.negate);
      return `${left} ${tree.kind === 'add' ? '+' : '-'} ${right}`;
    }
  }
}

function startsWithDigit(latex: string): boolean {
  return /^[\d.-]/.test(latex);
}
