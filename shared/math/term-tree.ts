/**
 * The expression tree of a candidate term, after the whitelist: only these node kinds exist, so everything
 * downstream (compiler, printer, degree analysis) handles a closed set. Exponents are integers by construction.
 */
export type TermTree =
  | { kind: 'number'; value: number }
  | { kind: 'symbol'; name: string }
  | { kind: 'negate'; arg: TermTree }
  | { kind: 'add' | 'subtract' | 'multiply' | 'divide'; left: TermTree; right: TermTree }
  | { kind: 'power'; base: TermTree; exponent: number }
  | { kind: 'sin' | 'cos'; arg: TermTree };

export type BinaryKind = 'add' | 'subtract' | 'multiply' | 'divide';

export function numberNode(value: number): TermTree {
  return { kind: 'number', value };
}

function isNumber(tree: TermTree, value?: number): tree is { kind: 'number'; value: number } {
  return tree.kind === 'number' && (value === undefined || tree.value === value);
}

/**
 * Builds a binary node, folding constants and the identities x+0, x*1, x*0, x/1, 0/x. Folding only removes
 * operations whose result is exact in floating point, so a folded tree computes the same numbers.
 */
export function binaryNode(kind: BinaryKind, left: TermTree, right: TermTree): TermTree {
  if (isNumber(left) && isNumber(right)) return numberNode(applyBinary(kind, left.value, right.value));
  switch (kind) {
    case 'add':
      if (isNumber(left, 0)) return right;
      if (isNumber(right, 0)) return left;
      break;
    case 'subtract':
      if (isNumber(right, 0)) return left;
      if (isNumber(left, 0)) return negateNode(right);
      break;
    case 'multiply':
      if (isNumber(left, 0) || isNumber(right, 0)) return numberNode(0);
      if (isNumber(left, 1)) return right;
      if (isNumber(right, 1)) return left;
      if (isNumber(left, -1)) return negateNode(right);
      if (isNumber(right, -1)) return negateNode(left);
      break;
    case 'divide':
      if (isNumber(left, 0)) return numberNode(0);
      if (isNumber(right, 1)) return left;
      break;
  }
  return { kind, left, right };
}

export function negateNode(arg: TermTree): TermTree {
  if (isNumber(arg)) return numberNode(-arg.value);
  if (arg.kind === 'negate') return arg.arg;
  return { kind: 'negate', arg };
}

export function powerNode(base: TermTree, exponent: number): TermTree {
  if (exponent === 0) return numberNode(1);
  if (exponent === 1) return base;
  if (isNumber(base)) return numberNode(base.value ** exponent);
  return { kind: 'power', base, exponent };
}

export function functionNode(kind: 'sin' | 'cos', arg: TermTree): TermTree {
  if (isNumber(arg)) return numberNode(kind === 'sin' ? Math.sin(arg.value) : Math.cos(arg.value));
  return { kind, arg };
}

export function applyBinary(kind: BinaryKind, a: number, b: number): number {
  switch (kind) {
    case 'add':
      return a + b;
    case 'subtract':
      return a - b;
    case 'multiply':
      return a * b;
    case 'divide':
      return a / b;
  }
}

/** Names of the symbols a tree uses. */
export function symbolsOf(tree: TermTree, into = new Set<string>()): Set<string> {
  switch (tree.kind) {
    case 'number':
      break;
    case 'symbol':
      into.add(tree.name);
      break;
    case 'negate':
    case 'sin':
    case 'cos':
      symbolsOf(tree.arg, into);
      break;
    case 'power':
      symbolsOf(tree.base, into);
      break;
    default:
      symbolsOf(tree.left, into);
      symbolsOf(tree.right, into);
  }
  return into;
}
