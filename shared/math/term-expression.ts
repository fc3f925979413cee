import type { MathNode } from 'mathjs';
import { DiscoveryInputError } from './discovery-input-error.js';
import { parseToTree } from './restricted-math.js';
import {
  applyBinary,
  binaryNode,
  functionNode,
  negateNode,
  powerNode,
  symbolsOf,
  type BinaryKind,
  type TermTree,
} from './term-tree.js';
import type { TermSymbols } from './term-symbols.js';

/** A term as typed, checked against the whitelist: its text, our tree, and mathjs's tree for differentiation. */
export interface ParsedExpression {
  text: string;
  tree: TermTree;
  mathTree: MathNode;
}

/** Refusal of one expression; the message always names the expression. */
export class TermError extends DiscoveryInputError {
  constructor(
    readonly term: string,
    problem: string,
  ) {
    super(`Term "${term}": ${problem}`);
  }
}

const maxExponent = 16;
const allowedSummary = 'terms may use numbers, the coordinate and velocity symbols, + - * / ^ (integer powers), sin and cos';

const operators: Record<string, BinaryKind | 'power'> = {
  add: 'add',
  subtract: 'subtract',
  multiply: 'multiply',
  divide: 'divide',
  pow: 'power',
};

/**
 * Parses a term typed in ordinary math notation (`dth^2*cos(th)`, `2 x`, `sin(x - y)`) and keeps it only if
 * every node is on the whitelist: numbers, known symbols, + - * / ^ with integer exponents, unary minus, sin
 * and cos. Accelerations (`ddx`) are accepted only when `allowAccelerations` is set: energies depend on
 * positions and velocities alone.
 */
export function parseExpression(
  text: string,
  symbols: TermSymbols,
  options: { allowAccelerations?: boolean } = {},
): ParsedExpression {
  if (text.trim() === '') throw new TermError(text, 'it is empty.');
  let mathTree: MathNode;
  try {
    mathTree = parseToTree(text);
  } catch (error) {
    throw new TermError(text, `it is not a valid expression (${(error as Error).message}).`);
  }
  const tree = convertTree(mathTree, text, symbols, options.allowAccelerations ?? false);
  return { text, tree, mathTree };
}

/**
 * Converts a mathjs tree into ours, refusing every node kind outside the whitelist. Also used on the trees
 * mathjs's differentiation produces, which only ever contain whitelisted kinds for whitelisted input.
 */
export function convertTree(node: MathNode, term: string, symbols: TermSymbols, allowAccelerations: boolean): TermTree {
  const convert = (child: MathNode) => convertTree(child, term, symbols, allowAccelerations);
  const n = node as MathNode & Record<string, unknown>;
  switch (node.type) {
    case 'ParenthesisNode':
      return convert(n['content'] as MathNode);
    case 'ConstantNode': {
      const value = n['value'];
      if (typeof value !== 'number' || !Number.isFinite(value)) {
        throw new TermError(term, `${JSON.stringify(value)} is not a number; ${allowedSummary}.`);
      }
      return { kind: 'number', value };
    }
    case 'SymbolNode':
      return convertSymbol(n['name'] as string, term, symbols, allowAccelerations);
    case 'OperatorNode':
      return convertOperator(n['fn'] as string, n['op'] as string, n['args'] as MathNode[], term, convert);
    case 'FunctionNode': {
      const fn = n['fn'] as MathNode & { name?: string };
      const args = n['args'] as MathNode[];
      const name = fn.type === 'SymbolNode' ? fn.name : undefined;
      if (name !== 'sin' && name !== 'cos') {
        throw new TermError(term, `function ${name ?? node.toString()} is not allowed; ${allowedSummary}.`);
      }
      if (args.length !== 1) throw new TermError(term, `${name} takes exactly one argument.`);
      return functionNode(name, convert(args[0]!));
    }
    default:
      throw new TermError(term, `"${node.toString()}" (${describeNodeType(node.type)}) is not allowed; ${allowedSummary}.`);
  }
}

function convertSymbol(name: string, term: string, symbols: TermSymbols, allowAccelerations: boolean): TermTree {
  const meaning = symbols.lookup(name);
  if (!meaning) {
    const known = [...symbols.coordinates, ...symbols.velocities].join(', ');
    throw new TermError(term, `unknown symbol "${name}" (known symbols: ${known}; constants such as pi must be written as numbers).`);
  }
  if (meaning.kind === 'acceleration' && !allowAccelerations) {
    throw new TermError(term, `"${name}" is an acceleration; energy terms depend on coordinates and velocities only.`);
  }
  return { kind: 'symbol', name };
}

function convertOperator(
  fn: string,
  op: string,
  args: MathNode[],
  term: string,
  convert: (child: MathNode) => TermTree,
): TermTree {
  if (fn === 'unaryMinus') return negateNode(convert(args[0]!));
  if (fn === 'unaryPlus') return convert(args[0]!);
  const kind = operators[fn];
  if (!kind || args.length !== 2) throw new TermError(term, `operator "${op}" is not allowed; ${allowedSummary}.`);
  const left = convert(args[0]!);
  const right = convert(args[1]!);
  if (kind !== 'power') return binaryNode(kind, left, right);
  const exponent = constantValue(right);
  if (exponent === null || !Number.isInteger(exponent)) {
    throw new TermError(term, `the exponent in "${args.map(String).join(' ^ ')}" must be a whole number.`);
  }
  if (Math.abs(exponent) > maxExponent) {
    throw new TermError(term, `the exponent ${exponent} is larger than ${maxExponent} in size.`);
  }
  return powerNode(left, exponent);
}

/** The value of a tree without symbols (exponents like `2 - 1` in mathjs derivatives), or null. */
function constantValue(tree: TermTree): number | null {
  if (symbolsOf(tree).size > 0) return null;
  return evaluateConstant(tree);
}

function evaluateConstant(tree: TermTree): number {
  switch (tree.kind) {
    case 'number':
      return tree.value;
    case 'negate':
      return -evaluateConstant(tree.arg);
    case 'sin':
      return Math.sin(evaluateConstant(tree.arg));
    case 'cos':
      return Math.cos(evaluateConstant(tree.arg));
    case 'power':
      return evaluateConstant(tree.base) ** tree.exponent;
    case 'symbol':
      throw new Error('constant expected');
    default:
      return applyBinary(tree.kind, evaluateConstant(tree.left), evaluateConstant(tree.right));
  }
}

function describeNodeType(type: string): string {
  const names: Record<string, string> = {
    AssignmentNode: 'an assignment',
    FunctionAssignmentNode: 'a function definition',
    AccessorNode: 'an index or property access',
    IndexNode: 'an index',
    ArrayNode: 'a matrix',
    ObjectNode: 'an object',
    ConditionalNode: 'a conditional',
    RangeNode: 'a range',
    RelationalNode: 'a comparison',
    BlockNode: 'several statements',
  };
  return names[type] ?? type;
}
