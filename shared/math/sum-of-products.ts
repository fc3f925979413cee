import { formatTerm } from './term-format.js';
import { binaryNode, numberNode, powerNode, type TermTree } from './term-tree.js';

/*
 * Our own simplifier for the trees of the equations of motion. mathjs's simplifier would turn decimal
 * coefficients into nearby fractions, so instead every expression is expanded into a sum of products
 * c * a_1^p_1 * ... * a_r^p_r and like products are collected. Atoms are symbols, sin(...) and cos(...) of a
 * simplified argument, and sums that cannot be expanded (a denominator, a large power). Coefficients are
 * combined in floating point only by products and sums of the numbers in the tree, so nothing is rounded
 * to a fraction. Products print in a fixed order, so equal expressions print alike.
 */

interface Factor {
  atom: TermTree;
  power: number;
}

interface Product {
  coefficient: number;
  /** Sum of the magnitudes of the contributions, to recognise a cancellation down to rounding. */
  magnitude: number;
  /** Factors keyed by the printed atom, so equal atoms share a key. */
  factors: Map<string, Factor>;
}

/** Products keyed by their printed factors. */
type Sum = Map<string, Product>;

/** Largest number of products an expansion may reach before the tree is left as it was. */
const MAX_PRODUCTS = 4000;
/** Largest power of a sum that is expanded; higher powers stay a power of the sum. */
const MAX_EXPANDED_POWER = 4;
/** A collected coefficient this small against its contributions is a cancellation down to rounding. */
const CANCELLATION = 16 * Number.EPSILON;

class TooLarge extends Error {}

/**
 * Expands a tree into a sum of products and collects like products: `c*2*dth - c*dth*(1 - 0)*2` becomes 0,
 * `cos(th2 - th1)` and `cos(th1 - th2)` are one atom, `sin(th2 - th1)` is `-sin(th1 - th2)`. The result
 * computes the same function; its numbers are products and sums of the numbers in the input. A tree whose
 * expansion would be very large comes back unchanged. Products that are just one of the `leading` symbols
 * print first (the force `u_x` at the head of a force vector).
 */
export function simplifyTree(tree: TermTree, leading: readonly string[] = []): TermTree {
  try {
    return sumToTree(toSum(tree), leading);
  } catch (error) {
    if (error instanceof TooLarge) return tree;
    throw error;
  }
}

function toSum(tree: TermTree): Sum {
  switch (tree.kind) {
    case 'number':
      return constantSum(tree.value);
    case 'symbol':
      return atomSum(tree, 1);
    case 'negate':
      return scaleSum(toSum(tree.arg), -1);
    case 'add':
      return addSums(toSum(tree.left), toSum(tree.right), 1);
    case 'subtract':
      return addSums(toSum(tree.left), toSum(tree.right), -1);
    case 'multiply':
      return multiplySums(toSum(tree.left), toSum(tree.right));
    case 'divide':
      return divideSums(toSum(tree.left), divisorProduct(tree.right));
    case 'power':
      return powerOfSum(toSum(tree.base), tree.exponent);
    case 'sin':
    case 'cos':
      return trigonometricSum(tree.kind, toSum(tree.arg));
  }
}

function constantSum(value: number): Sum {
  const sum: Sum = new Map();
  if (value !== 0) sum.set('', { coefficient: value, magnitude: Math.abs(value), factors: new Map() });
  return sum;
}

function atomSum(atom: TermTree, power: number): Sum {
  const key = formatTerm(atom);
  const factors = new Map([[key, { atom, power }]]);
  return new Map([[productKey(factors), { coefficient: 1, magnitude: 1, factors }]]);
}

function productKey(factors: Map<string, Factor>): string {
  return [...factors.entries()]
    .sort(([a], [b]) => compareAtomKeys(a, b))
    .map(([key, f]) => (f.power === 1 ? key : `${key}^${f.power}`))
    .join('*');
}

/** Plain symbols before functions and sums, then alphabetical: `dth^2*cos(th)`, not `cos(th)*dth^2`. */
function compareAtomKeys(a: string, b: string): number {
  const rank = (key: string) => (/^[A-Za-z_][A-Za-z0-9_]*$/.test(key) ? 0 : 1);
  return rank(a) - rank(b) || (a < b ? -1 : a > b ? 1 : 0);
}

function addProduct(sum: Sum, key: string, product: Product): void {
  const existing = sum.get(key);
  if (!existing) {
    sum.set(key, { ...product, factors: new Map(product.factors) });
    if (sum.size > MAX_PRODUCTS) throw new TooLarge();
    return;
  }
  existing.coefficient += product.coefficient;
  existing.magnitude += product.magnitude;
}

/** Drops products whose coefficient cancelled to zero or to rounding noise of its contributions. */
function pruned(sum: Sum): Sum {
  for (const [key, product] of sum) {
    if (product.coefficient === 0 || Math.abs(product.coefficient) <= CANCELLATION * product.magnitude) sum.delete(key);
  }
  return sum;
}

function scaleSum(sum: Sum, factor: number): Sum {
  const result: Sum = new Map();
  for (const [key, p] of sum) {
    result.set(key, { coefficient: p.coefficient * factor, magnitude: p.magnitude * Math.abs(factor), factors: p.factors });
  }
  return pruned(result);
}

function addSums(a: Sum, b: Sum, sign: 1 | -1): Sum {
  const result: Sum = new Map();
  for (const [key, p] of a) addProduct(result, key, p);
  for (const [key, p] of b) addProduct(result, key, { ...p, coefficient: sign * p.coefficient });
  return pruned(result);
}

function multiplyProducts(a: Product, b: Product): { key: string; product: Product } {
  const factors = new Map(a.factors);
  for (const [key, f] of b.factors) {
    const power = (factors.get(key)?.power ?? 0) + f.power;
    if (power === 0) factors.delete(key);
    else factors.set(key, { atom: f.atom, power });
  }
  const coefficient = a.coefficient * b.coefficient;
  return { key: productKey(factors), product: { coefficient, magnitude: a.magnitude * b.magnitude, factors } };
}

function multiplySums(a: Sum, b: Sum): Sum {
  if (a.size * b.size > MAX_PRODUCTS) throw new TooLarge();
  const result: Sum = new Map();
  for (const pa of a.values()) {
    for (const pb of b.values()) {
      const { key, product } = multiplyProducts(pa, pb);
      addProduct(result, key, product);
    }
  }
  return pruned(result);
}

function singleProduct(sum: Sum): Product | null {
  return sum.size === 1 ? sum.values().next().value! : null;
}

/**
 * A divisor as a single product without expanding it: `(x + 1)^2 * sin(x)` stays the atom `x + 1` squared
 * times sin(x), so a quotient keeps its denominator's shape instead of an expanded polynomial.
 */
function divisorProduct(tree: TermTree): Product {
  if (tree.kind === 'multiply') {
    return multiplyProducts(divisorProduct(tree.left), divisorProduct(tree.right)).product;
  }
  if (tree.kind === 'power') {
    const base = divisorProduct(tree.base);
    const factors = new Map<string, Factor>();
    for (const [key, f] of base.factors) factors.set(key, { atom: f.atom, power: f.power * tree.exponent });
    const coefficient = base.coefficient ** tree.exponent;
    return { coefficient, magnitude: Math.abs(coefficient), factors };
  }
  const sum = toSum(tree);
  if (sum.size === 0) return { coefficient: 0, magnitude: 0, factors: new Map() };
  const single = singleProduct(sum);
  if (single) return single;
  const atom = sumToTree(sum, []);
  return { coefficient: 1, magnitude: 1, factors: new Map([[formatTerm(atom), { atom, power: 1 }]]) };
}

/** a / d: each coefficient is divided by d's (one rounding, as in the tree) and d's factors enter with negative powers. */
function divideSums(a: Sum, divisor: Product): Sum {
  const inverse = new Map<string, Factor>();
  for (const [key, f] of divisor.factors) inverse.set(key, { atom: f.atom, power: -f.power });
  const result: Sum = new Map();
  for (const p of a.values()) {
    const { key, product } = multiplyProducts(p, { coefficient: 1, magnitude: 1, factors: inverse });
    const scale = Math.abs(divisor.coefficient);
    addProduct(result, key, { ...product, coefficient: product.coefficient / divisor.coefficient, magnitude: product.magnitude / scale });
  }
  return pruned(result);
}

function powerOfSum(base: Sum, exponent: number): Sum {
  if (exponent === 0) return constantSum(1);
  const single = singleProduct(base);
  if (single) {
    const factors = new Map<string, Factor>();
    for (const [key, f] of single.factors) factors.set(key, { atom: f.atom, power: f.power * exponent });
    const coefficient = single.coefficient ** exponent;
    return new Map([[productKey(factors), { coefficient, magnitude: Math.abs(coefficient), factors }]]);
  }
  if (base.size === 0) return constantSum(0 ** exponent);
  if (exponent > 0 && exponent <= MAX_EXPANDED_POWER) {
    let result = base;
    for (let k = 1; k < exponent; k++) result = multiplySums(result, base);
    return result;
  }
  return atomSum(sumToTree(base, []), exponent);
}

/** sin and cos of a collected argument; the argument's leading product is made positive (sin odd, cos even). */
function trigonometricSum(kind: 'sin' | 'cos', arg: Sum): Sum {
  const argTree = sumToTree(arg, []);
  if (argTree.kind === 'number') return constantSum(kind === 'sin' ? Math.sin(argTree.value) : Math.cos(argTree.value));
  const first = orderedProducts(arg, [])[0]!;
  if (first.coefficient < 0) {
    const flipped = sumToTree(scaleSum(arg, -1), []);
    const atom = atomSum({ kind, arg: flipped }, 1);
    return kind === 'sin' ? scaleSum(atom, -1) : atom;
  }
  return atomSum({ kind, arg: argTree }, 1);
}

/**
 * Products in print order: the `leading` symbols alone first, then by total degree of their factors (higher
 * first), then by key; the constant last.
 */
function orderedProducts(sum: Sum, leading: readonly string[]): Product[] {
  const degree = (p: Product) => [...p.factors.values()].reduce((d, f) => d + Math.abs(f.power), 0);
  const lead = (key: string) => (leading.includes(key) ? 0 : 1);
  return [...sum.entries()]
    .sort(
      ([ka, a], [kb, b]) =>
        lead(ka) - lead(kb) || (ka === '' ? 1 : 0) - (kb === '' ? 1 : 0) || degree(b) - degree(a) || (ka < kb ? -1 : ka > kb ? 1 : 0),
    )
    .map(([, p]) => p);
}

/** The first product carries its sign in its number (`-0.5*x`), later ones as a subtraction. */
function sumToTree(sum: Sum, leading: readonly string[]): TermTree {
  let tree: TermTree | null = null;
  for (const product of orderedProducts(sum, leading)) {
    const negative = product.coefficient < 0;
    if (tree === null) tree = productToTree(product.coefficient, product.factors);
    else tree = binaryNode(negative ? 'subtract' : 'add', tree, productToTree(Math.abs(product.coefficient), product.factors));
  }
  return tree ?? numberNode(0);
}

function productToTree(coefficient: number, factors: Map<string, Factor>): TermTree {
  const ordered = [...factors.entries()].sort(([a], [b]) => compareAtomKeys(a, b)).map(([, f]) => f);
  let numerator: TermTree = numberNode(coefficient);
  let denominator: TermTree | null = null;
  for (const f of ordered) {
    if (f.power > 0) numerator = binaryNode('multiply', numerator, powerNode(f.atom, f.power));
    else {
      const part = powerNode(f.atom, -f.power);
      denominator = denominator === null ? part : binaryNode('multiply', denominator, part);
    }
  }
  return denominator === null ? numerator : binaryNode('divide', numerator, denominator);
}
