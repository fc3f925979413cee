import type { GramProblem, RankedSubset } from '../math/sweep-problem.js';

/**
 * Coefficients of a leaderboard subset in the units of the original columns: solves G_SS c' = b_S on the
 * scaled problem by Cholesky (the subset passed the kernel's pivot test, so G_SS is positive definite) and
 * divides by the column scales. Columns are the known ones, then the chosen candidates.
 */
export function subsetCoefficients(problem: GramProblem, scales: readonly number[], subset: RankedSubset): number[] {
  const columns = [...Array.from({ length: problem.knownCount }, (_, i) => i), ...subset.members.map((j) => problem.knownCount + j)];
  const k = columns.length;
  const m = problem.columnCount;
  const factor = new Float64Array(k * k);
  for (let i = 0; i < k; i++) {
    for (let j = 0; j <= i; j++) {
      let sum = problem.gram[columns[i]! * m + columns[j]!]!;
      for (let p = 0; p < j; p++) sum -= factor[i * k + p]! * factor[j * k + p]!;
      factor[i * k + j] = i === j ? Math.sqrt(sum) : sum / factor[j * k + j]!;
    }
  }
  const z = new Float64Array(k);
  for (let i = 0; i < k; i++) {
    let sum = problem.rhs[columns[i]!]!;
    for (let p = 0; p < i; p++) sum -= factor[i * k + p]! * z[p]!;
    z[i] = sum / factor[i * k + i]!;
  }
  const scaled = new Float64Array(k);
  for (let i = k - 1; i >= 0; i--) {
    let sum = z[i]!;
    for (let p = i + 1; p < k; p++) sum -= factor[p * k + i]! * scaled[p]!;
    scaled[i] = sum / factor[i * k + i]!;
  }
  return columns.map((column, i) => scaled[i]! / scales[column]!);
}
