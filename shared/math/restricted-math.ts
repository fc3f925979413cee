import { all, create, type MathNode } from 'mathjs';

/**
 * The one mathjs instance of the discovery engine, used only to parse text into a tree and to differentiate
 * trees. Nothing here ever evaluates user text: trees are checked against a whitelist and compiled by our own
 * code (term-compiler.ts). The instance still has the functions that could reach beyond an expression switched
 * off inside expressions, as the mathjs security notes advise, in case a later change evaluates a tree.
 */
const math = create(all, { number: 'number' });
const parse = math.parse;
const derivative = math.derivative;

function refuse(name: string) {
  return () => {
    throw new Error(`${name} is disabled`);
  };
}
math.import(
  {
    import: refuse('import'),
    createUnit: refuse('createUnit'),
    evaluate: refuse('evaluate'),
    parse: refuse('parse'),
    simplify: refuse('simplify'),
    derivative: refuse('derivative'),
    compile: refuse('compile'),
  },
  { override: true },
);

/** Parses text into a mathjs tree; throws mathjs's own SyntaxError on malformed text. */
export function parseToTree(text: string): MathNode {
  return parse(text);
}

/**
 * Partial derivative of a tree. `simplified` asks mathjs to simplify the result, which is what shows that a
 * derivative is identically zero; the unsimplified result keeps every constant exactly as typed (mathjs's
 * simplification turns decimals into nearby fractions), so it is the one we compile.
 */
export function differentiateTree(tree: MathNode, symbol: string, simplified: boolean): MathNode {
  return derivative(tree, symbol, { simplify: simplified });
}

const expressionKeywords = ['true', 'false', 'null', 'undefined', 'NaN', 'Infinity', 'end', 'to', 'in', 'mod', 'not', 'and', 'or', 'xor'];

/**
 * Why a name cannot be a symbol of ours in expression notation, or null when it can: mathjs keywords cannot be
 * variables at all, and its constants (e, pi, i, phi, tau, ...) would be read as the constant by anyone who
 * evaluates our expressions with mathjs without naming every symbol.
 */
export function reservedNameReason(name: string): string | null {
  if (expressionKeywords.includes(name)) return 'is a keyword of the expression notation';
  const known = (math as unknown as Record<string, unknown>)[name];
  if (known !== undefined && typeof known !== 'function') return 'is a predefined constant of the expression notation';
  return null;
}
