import { compileTerm, type CompiledTerm } from './term-compiler.js';
import { isSymbolicallyConstant, legendreBracketTree, timeDerivativeTree } from './term-derivative.js';
import { parseExpression } from './term-expression.js';
import { formatTerm } from './term-format.js';
import { symbolsOf, type TermTree } from './term-tree.js';
import type { TermSymbols } from './term-symbols.js';
import { velocityDegree } from './velocity-degree.js';

/**
 * A candidate term ready for the regression: checked, differentiated once, and compiled into the three
 * columns the method needs (its values, its time derivative, its Legendre bracket).
 */
export interface CandidateTerm {
  /** Canonical spelling, printed from the tree; used in every output. */
  text: string;
  /** The text as the user (or the generator) wrote it. */
  typed: string;
  tree: TermTree;
  /** Velocity degree when homogeneous, else null (see velocity-degree.ts). */
  velocityDegree: number | null;
  /** True when every partial derivative simplifies to zero. */
  constant: boolean;
  /** True when the time derivative involves accelerations (the derivative form then needs them). */
  needsAcceleration: boolean;
  value: CompiledTerm;
  timeDerivative: CompiledTerm;
  legendreBracket: CompiledTerm;
}

/** Parses, checks and compiles one term; throws TermError naming the term when the text is refused. */
export function prepareTerm(typed: string, symbols: TermSymbols): CandidateTerm {
  const expression = parseExpression(typed, symbols);
  const derivative = timeDerivativeTree(expression, symbols);
  const accelerations = new Set(symbols.accelerations);
  return {
    text: formatTerm(expression.tree),
    typed,
    tree: expression.tree,
    velocityDegree: velocityDegree(expression.tree, symbols),
    constant: isSymbolicallyConstant(expression),
    needsAcceleration: [...symbolsOf(derivative)].some((name) => accelerations.has(name)),
    value: compileTerm(expression.tree),
    timeDerivative: compileTerm(derivative),
    legendreBracket: compileTerm(legendreBracketTree(expression, symbols)),
  };
}
