import type { MathNode } from 'mathjs';
import { DiscoveryInputError } from './discovery-input-error.js';
import { differentiateTree } from './restricted-math.js';
import { simplifyTree } from './sum-of-products.js';
import { convertTree, parseExpression, type ParsedExpression } from './term-expression.js';
import { formatTerm } from './term-format.js';
import { binaryNode, numberNode, symbolsOf, type TermTree } from './term-tree.js';
import { TermSymbols } from './term-symbols.js';

/** One term of a Lagrangian with its coefficient; a null coefficient (not identifiable) is left out. */
export interface LagrangianTerm {
  term: string;
  coefficient: number | null;
}

/**
 * M(q, dq) ddq = f(q, dq, u), symbolically: the mass matrix and the force vector as simplified trees and as
 * text in the notation users type. Symbols: the coordinates, their velocities `d<name>`, and the generalized
 * force on each coordinate `u_<name>`.
 */
export interface EquationsOfMotion {
  coordinates: string[];
  /** `u_<name>` per coordinate, in coordinate order. */
  forceSymbols: string[];
  massMatrix: TermTree[][];
  forceVector: TermTree[];
  massMatrixText: string[][];
  forceVectorText: string[];
  /** Terms left out because their coefficient is null (velocity degree one: not identifiable from energy). */
  leftOut: string[];
}

/** The name of the generalized force on a coordinate in the equations and the exports. */
export function forceSymbol(coordinate: string): string {
  return `u_${coordinate}`;
}

/**
 * Euler-Lagrange with generalized forces, d/dt (dL/ddq_i) - dL/dq_i = u_i, written as M ddq = f with
 * (method.md section 5; any mechanics text, e.g. Goldstein, Classical Mechanics, ch. 1-2)
 *   M_ik = d^2 L / ddq_i ddq_k,
 *   f_i  = u_i + dL/dq_i - sum_k (d^2 L / ddq_i dq_k) dq_k.
 * L = sum_j c_j theta_j; every term is differentiated symbolically by the restricted mathjs instance, scaled by
 * its coefficient, and the sums are expanded and collected by our own simplifier (sum-of-products.ts), so
 * coefficients keep every digit. Throws DiscoveryInputError for a term that is refused or for force symbols
 * that clash with a coordinate's name.
 */
export function deriveEquationsOfMotion(coordinates: readonly string[], lagrangian: readonly LagrangianTerm[]): EquationsOfMotion {
  const symbols = new TermSymbols(coordinates);
  const forceSymbols = coordinates.map(forceSymbol);
  for (const name of forceSymbols) {
    if (symbols.lookup(name)) {
      throw new DiscoveryInputError(`The force symbol "${name}" would clash with a coordinate or velocity of the same name: rename the coordinate.`);
    }
  }
  const n = coordinates.length;
  const velocities = symbols.velocities;
  const massSums: TermTree[][] = Array.from({ length: n }, () => Array.from({ length: n }, () => numberNode(0)));
  const forceSums: TermTree[] = forceSymbols.map((name) => ({ kind: 'symbol', name }) as TermTree);
  const leftOut: string[] = [];

  for (const { term, coefficient } of lagrangian) {
    if (coefficient === null) {
      leftOut.push(term);
      continue;
    }
    if (coefficient === 0) continue;
    const expression = parseExpression(term, symbols);
    const c = numberNode(coefficient);
    const used = symbolsOf(expression.tree);
    for (let i = 0; i < n; i++) {
      if (!used.has(velocities[i]!) && !used.has(coordinates[i]!)) continue;
      const byVelocity = derivativeNode(expression.mathTree, velocities[i]!, used);
      for (let k = i; k < n; k++) {
        const second = secondDerivative(expression, byVelocity, velocities[k]!, symbols);
        massSums[i]![k] = binaryNode('add', massSums[i]![k]!, binaryNode('multiply', c, second));
      }
      let generalized = partial(expression, expression.mathTree, coordinates[i]!, symbols);
      for (let k = 0; k < n; k++) {
        const mixed = secondDerivative(expression, byVelocity, coordinates[k]!, symbols);
        generalized = binaryNode('subtract', generalized, binaryNode('multiply', mixed, { kind: 'symbol', name: velocities[k]! }));
      }
      forceSums[i] = binaryNode('add', forceSums[i]!, binaryNode('multiply', c, generalized));
    }
  }

  const upper = massSums.map((row, i) => row.map((entry, k) => (k >= i ? simplifyTree(entry) : null)));
  const massMatrix = upper.map((row, i) => row.map((_, k) => upper[Math.min(i, k)]![Math.max(i, k)]!));
  const forceVector = forceSums.map((sum, i) => simplifyTree(sum, [forceSymbols[i]!]));
  return {
    coordinates: [...coordinates],
    forceSymbols,
    massMatrix,
    forceVector,
    massMatrixText: massMatrix.map((row) => row.map(formatTerm)),
    forceVectorText: forceVector.map(formatTerm),
    leftOut,
  };
}

/** mathjs's first derivative, or null when the symbol does not occur (a zero). */
function derivativeNode(tree: MathNode, symbol: string, used: Set<string>): MathNode | null {
  return used.has(symbol) ? differentiateTree(tree, symbol, false) : null;
}

function partial(expression: ParsedExpression, tree: MathNode, symbol: string, symbols: TermSymbols): TermTree {
  if (!symbolsOf(expression.tree).has(symbol)) return numberNode(0);
  return convertTree(differentiateTree(tree, symbol, false), expression.text, symbols, false);
}

function secondDerivative(expression: ParsedExpression, first: MathNode | null, symbol: string, symbols: TermSymbols): TermTree {
  if (first === null) return numberNode(0);
  return convertTree(differentiateTree(first, symbol, false), expression.text, symbols, false);
}
