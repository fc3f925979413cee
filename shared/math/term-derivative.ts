import { convertTree, type ParsedExpression } from './term-expression.js';
import { differentiateTree } from './restricted-math.js';
import { binaryNode, numberNode, symbolsOf, type TermTree } from './term-tree.js';
import type { TermSymbols } from './term-symbols.js';

/**
 * The partial derivative of a term with respect to one symbol, taken symbolically by mathjs and brought back
 * through the whitelist. mathjs's unsimplified result is used so every constant stays exactly as typed;
 * our tree builders fold the trivial factors (`1 * x^(2 - 1)`).
 */
export function partialDerivative(expression: ParsedExpression, symbol: string, symbols: TermSymbols): TermTree {
  if (!symbolsOf(expression.tree).has(symbol)) return numberNode(0);
  return convertTree(differentiateTree(expression.mathTree, symbol, false), expression.text, symbols, true);
}

/**
 * True when mathjs's simplifier shows every partial derivative to be zero, so the term is a constant whatever
 * its spelling (`sin(x)^2 + cos(x)^2`, `x/x`). A constant has no time derivative and can never be identified.
 */
export function isSymbolicallyConstant(expression: ParsedExpression): boolean {
  for (const symbol of symbolsOf(expression.tree)) {
    const simplified = differentiateTree(expression.mathTree, symbol, true);
    if (!(simplified.type === 'ConstantNode' && (simplified as unknown as { value: unknown }).value === 0)) return false;
  }
  return true;
}

/**
 * d(term)/dt by the chain rule, as a tree: sum over coordinates of (d term/d q_i) dq_i + (d term/d dq_i) ddq_i.
 */
export function timeDerivativeTree(expression: ParsedExpression, symbols: TermSymbols): TermTree {
  let total: TermTree = numberNode(0);
  symbols.coordinates.forEach((coordinate, i) => {
    const velocity = symbols.velocities[i]!;
    const acceleration = symbols.accelerations[i]!;
    const byPosition = partialDerivative(expression, coordinate, symbols);
    const byVelocity = partialDerivative(expression, velocity, symbols);
    total = binaryNode('add', total, binaryNode('multiply', byPosition, { kind: 'symbol', name: velocity }));
    total = binaryNode('add', total, binaryNode('multiply', byVelocity, { kind: 'symbol', name: acceleration }));
  });
  return total;
}

/**
 * The term's column of the Legendre step (method.md section 4): sum_i dq_i (d term/d dq_i) - term. For a term
 * of velocity degree p it equals (p - 1) times the term.
 */
export function legendreBracketTree(expression: ParsedExpression, symbols: TermSymbols): TermTree {
  let total: TermTree = numberNode(0);
  symbols.velocities.forEach((velocity) => {
    const byVelocity = partialDerivative(expression, velocity, symbols);
    total = binaryNode('add', total, binaryNode('multiply', { kind: 'symbol', name: velocity }, byVelocity));
  });
  return binaryNode('subtract', total, expression.tree);
}
