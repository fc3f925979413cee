import type { TermTree } from './term-tree.js';
import type { TermSymbols } from './term-symbols.js';

/**
 * The degree p of a term in the velocities when the term is homogeneous in them (dx^2*cos(y): 2, cos(x): 0,
 * dx*x: 1), or null when it is not (dx^2 + x). Read off the tree: velocities count 1, coordinates and numbers
 * 0, products add degrees, quotients subtract them, sums need equal degrees, sin and cos need degree 0.
 */
export function velocityDegree(tree: TermTree, symbols: TermSymbols): number | null {
  switch (tree.kind) {
    case 'number':
      return 0;
    case 'symbol': {
      const meaning = symbols.lookup(tree.name);
      if (!meaning || meaning.kind === 'acceleration') return null;
      return meaning.kind === 'velocity' ? 1 : 0;
    }
    case 'negate':
      return velocityDegree(tree.arg, symbols);
    case 'sin':
    case 'cos':
      return velocityDegree(tree.arg, symbols) === 0 ? 0 : null;
    case 'power': {
      const base = velocityDegree(tree.base, symbols);
      return base === null ? null : base * tree.exponent + 0; // + 0 turns -0 into 0
    }
    case 'add':
    case 'subtract': {
      const left = velocityDegree(tree.left, symbols);
      const right = velocityDegree(tree.right, symbols);
      return left !== null && left === right ? left : null;
    }
    case 'multiply':
    case 'divide': {
      const left = velocityDegree(tree.left, symbols);
      const right = velocityDegree(tree.right, symbols);
      if (left === null || right === null) return null;
      return tree.kind === 'multiply' ? left + right : left - right;
    }
  }
}
