import { buildGramProblem } from '../../../shared/math/gram-problem.js';
import type { GramProblem } from '../../../shared/math/sweep-problem.js';
import { createNormalRandom, createSeededRandom } from '../../../shared/math/seeded-random.js';

/** A random regression with its rows kept, so that the same problem can be solved the straightforward way. */
export interface BenchProblem {
  rowCount: number;
  /** The columns of A, unscaled. */
  columns: Float64Array[];
  y: Float64Array;
  problem: GramProblem;
  /** Candidates y was built from. */
  trueMembers: number[];
}

export interface BenchProblemShape {
  rowCount: number;
  columnCount: number;
  seed: number;
  /** Columns y is made of (with noise on top). */
  trueMembers: number[];
  noise: number;
}

/**
 * Columns with different scales (so that scaling matters) and mild correlation through a shared component;
 * y is a combination of `trueMembers` plus noise. No known columns.
 */
export function buildBenchProblem(shape: BenchProblemShape): BenchProblem {
  const { rowCount, columnCount, seed, trueMembers, noise } = shape;
  const normal = createNormalRandom(createSeededRandom(seed));
  const columnScales = Array.from({ length: columnCount }, (_, j) => 10 ** ((j % 7) - 3));
  const columns = Array.from({ length: columnCount }, () => new Float64Array(rowCount));
  const y = new Float64Array(rowCount);
  for (let r = 0; r < rowCount; r++) {
    const shared = normal();
    for (let j = 0; j < columnCount; j++) columns[j][r] = columnScales[j] * (normal() + 0.3 * shared);
    let value = noise * normal();
    trueMembers.forEach((j, i) => (value += ((i + 1) * columns[j][r]) / columnScales[j]));
    y[r] = value;
  }
  const { problem } = buildGramProblem(columns, y, 0);
  return { rowCount, columns, y, problem, trueMembers };
}
