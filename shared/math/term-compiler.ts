import { integerPower } from './integer-power.js';
import type { TermTree } from './term-tree.js';

/** Sample columns by symbol name (`th`, `dth`, `ddth`), all of the same length. */
export interface SampleColumns {
  length: number;
  column(name: string): Float64Array;
}

/** A compiled expression: evaluates on every sample at once and returns a fresh column. */
export type CompiledTerm = (samples: SampleColumns) => Float64Array;

type Part = number | ((samples: SampleColumns) => Float64Array);

/**
 * Compiles a whitelisted tree into closures that work a whole column at a time. No text is ever evaluated:
 * each node becomes a loop over typed arrays, so a term costs a few passes over the samples.
 */
export function compileTerm(tree: TermTree): CompiledTerm {
  const part = compilePart(tree);
  if (typeof part === 'number') return (samples) => new Float64Array(samples.length).fill(part);
  return part;
}

function compilePart(tree: TermTree): Part {
  switch (tree.kind) {
    case 'number':
      return tree.value;
    case 'symbol': {
      const name = tree.name;
      return (samples) => Float64Array.from(samples.column(name));
    }
    case 'negate':
      return mapPart(compilePart(tree.arg), (a) => -a);
    case 'sin':
      return mapPart(compilePart(tree.arg), Math.sin);
    case 'cos':
      return mapPart(compilePart(tree.arg), Math.cos);
    case 'power':
      return mapPart(compilePart(tree.base), integerPower(tree.exponent));
    case 'add':
      return combineParts(compilePart(tree.left), compilePart(tree.right), (a, b) => a + b);
    case 'subtract':
      return combineParts(compilePart(tree.left), compilePart(tree.right), (a, b) => a - b);
    case 'multiply':
      return combineParts(compilePart(tree.left), compilePart(tree.right), (a, b) => a * b);
    case 'divide':
      return combineParts(compilePart(tree.left), compilePart(tree.right), (a, b) => a / b);
  }
}

function mapPart(part: Part, f: (a: number) => number): Part {
  if (typeof part === 'number') return f(part);
  return (samples) => {
    const column = part(samples);
    for (let i = 0; i < column.length; i++) column[i] = f(column[i]!);
    return column;
  };
}

function combineParts(left: Part, right: Part, f: (a: number, b: number) => number): Part {
  if (typeof left === 'number' && typeof right === 'number') return f(left, right);
  if (typeof left === 'number') {
    const vector = right as Exclude<Part, number>;
    return (samples) => {
      const column = vector(samples);
      for (let i = 0; i < column.length; i++) column[i] = f(left, column[i]!);
      return column;
    };
  }
  if (typeof right === 'number') {
    const vector = left as Exclude<Part, number>;
    return (samples) => {
      const column = vector(samples);
      for (let i = 0; i < column.length; i++) column[i] = f(column[i]!, right);
      return column;
    };
  }
  return (samples) => {
    const a = left(samples);
    const b = right(samples);
    for (let i = 0; i < a.length; i++) a[i] = f(a[i]!, b[i]!);
    return a;
  };
}

/** Sample columns over plain arrays, keyed by symbol name. */
export function sampleColumns(columns: Record<string, Float64Array>, length: number): SampleColumns {
  return {
    length,
    column(name) {
      const column = columns[name];
      if (!column) throw new Error(`no samples for symbol ${name}`);
      return column;
    },
  };
}
