import type { GramProblem } from './sweep-problem.js';

/**
 * Forms the reduced problem the sweep kernel works on (method.md section 3): G = A^T A and b = A^T y after
 * scaling every column of A to unit Euclidean norm, and y^T y. Columns must be ordered known terms first.
 * Returns the scales (column norms) so coefficients of the scaled problem can be turned back.
 */
export function buildGramProblem(
  columns: readonly Float64Array[],
  rhs: Float64Array,
  knownCount: number,
): { problem: GramProblem; scales: Float64Array } {
  const m = columns.length;
  const scales = Float64Array.from(columns, (column) => Math.sqrt(dot(column, column)));
  const zero = scales.findIndex((scale) => !(scale > 0 && Number.isFinite(scale)));
  if (zero >= 0) throw new RangeError(`column ${zero} is zero or not finite; screen such columns out before the sweep`);
  const gram = new Float64Array(m * m);
  const scaledRhs = new Float64Array(m);
  for (let i = 0; i < m; i++) {
    gram[i * m + i] = 1;
    for (let j = i + 1; j < m; j++) {
      const value = dot(columns[i]!, columns[j]!) / (scales[i]! * scales[j]!);
      gram[i * m + j] = value;
      gram[j * m + i] = value;
    }
    scaledRhs[i] = dot(columns[i]!, rhs) / scales[i]!;
  }
  return { problem: { columnCount: m, knownCount, gram, rhs: scaledRhs, yty: dot(rhs, rhs) }, scales };
}

function dot(a: Float64Array, b: Float64Array): number {
  let sum = 0;
  for (let i = 0; i < a.length; i++) sum += a[i]! * b[i]!;
  return sum;
}
