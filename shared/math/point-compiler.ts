import { integerPower } from './integer-power.js';
import type { TermTree } from './term-tree.js';

/** A compiled expression evaluated at one point: the values of its symbols by slot, as given at compile time. */
export type PointFunction = (values: Float64Array) => number;

/**
 * Compiles a whitelisted tree into nested closures that evaluate it at one point, for the inner loop of a
 * simulation: symbols are resolved to slots of a value array once, so a call allocates nothing. Integer powers
 * use the same repeated squaring as the column compiler (integer-power.ts), so both give the same numbers.
 */
export function compilePoint(tree: TermTree, slots: ReadonlyMap<string, number>): PointFunction {
  switch (tree.kind) {
    case 'number': {
      const value = tree.value;
      return () => value;
    }
    case 'symbol': {
      const slot = slots.get(tree.name);
      if (slot === undefined) throw new Error(`compilePoint: no slot for symbol ${tree.name}`);
      return (v) => v[slot]!;
    }
    case 'negate': {
      const arg = compilePoint(tree.arg, slots);
      return (v) => -arg(v);
    }
    case 'sin': {
      const arg = compilePoint(tree.arg, slots);
      return (v) => Math.sin(arg(v));
    }
    case 'cos': {
      const arg = compilePoint(tree.arg, slots);
      return (v) => Math.cos(arg(v));
    }
    case 'power': {
      const base = compilePoint(tree.base, slots);
      const power = integerPower(tree.exponent);
      return (v) => power(base(v));
    }
    case 'add': {
      const [a, b] = [compilePoint(tree.left, slots), compilePoint(tree.right, slots)];
      return (v) => a(v) + b(v);
    }
    case 'subtract': {
      const [a, b] = [compilePoint(tree.left, slots), compilePoint(tree.right, slots)];
      return (v) => a(v) - b(v);
    }
    case 'multiply': {
      const [a, b] = [compilePoint(tree.left, slots), compilePoint(tree.right, slots)];
      return (v) => a(v) * b(v);
    }
    case 'divide': {
      const [a, b] = [compilePoint(tree.left, slots), compilePoint(tree.right, slots)];
      return (v) => a(v) / b(v);
    }
  }
}
