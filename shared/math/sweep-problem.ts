/**
 * The reduced form of a sweep: what the kernel needs once the recordings have been turned into a regression
 * matrix A (N x m) and right side y. Its size is independent of the number of samples, which is why shards
 * can be shipped to any worker cheaply.
 *
 * Columns are ordered known terms first: columns 0..knownCount-1 are in every model. The remaining
 * m' = columnCount - knownCount columns are the candidates the sweep chooses subsets from; a subset is
 * given by the indices of its members among those candidates (0..m'-1), ascending.
 */
export interface GramProblem {
  /** m: all columns, known ones first. */
  columnCount: number;
  /** Leading columns that are in every model. */
  knownCount: number;
  /** Row-major m x m matrix A^T A after scaling every column of A to unit Euclidean norm. */
  gram: Float64Array;
  /** A^T y with the same column scaling (length m). */
  rhs: Float64Array;
  /** y^T y. */
  yty: number;
}

/** A contiguous range of subset ranks of one size (number of candidate terms beyond the known ones). */
export interface SweepSlice {
  size: number;
  /** First rank in the slice, inclusive. */
  firstRank: number;
  /** Rank after the last one, exclusive. */
  endRank: number;
}

/** One evaluated subset that made it onto a leaderboard. */
export interface RankedSubset {
  /** Number of candidate terms beyond the known ones. */
  size: number;
  /** Indices among the candidates (0..m'-1), ascending. */
  members: number[];
  /** Residual sum of squares of the scaled problem. */
  rss: number;
}

export interface SweepProgress {
  /** Subsets scored so far (rank-deficient ones are not included). */
  evaluated: number;
  /** Rank-deficient subsets skipped so far; evaluated + rejected is the number of subsets covered. */
  rejected: number;
}

export interface SweepOptions {
  /** Leaderboard length, per size and overall. */
  top: number;
  /**
   * Relative pivot tolerance: a subset whose new Cholesky pivot squared falls below
   * pivotTolerance (relative to the unit diagonal of the scaled Gram matrix) is rank deficient and rejected.
   */
  pivotTolerance?: number;
  /** Called at checkpoints, at least every 50 ms of work. */
  onProgress?: (progress: SweepProgress) => void;
  /**
   * Least time between two checkpoints in milliseconds (default 25). 0 calls them as often as the kernel
   * reads the clock, which tests use to stop early on small problems.
   */
  checkpointMs?: number;
  /** Checked at the same checkpoints; returning true stops the sweep with partial results. */
  shouldStop?: () => boolean;
}

export interface SweepOutcome {
  /** Subsets scored (rank-deficient ones are not included). */
  evaluated: number;
  /** Rank-deficient subsets skipped. */
  rejected: number;
  /** True when shouldStop ended the work before every slice was done. */
  stopped: boolean;
  /** Best subsets overall, lowest RSS first, at most `top`. */
  best: RankedSubset[];
  /** Best subsets per size, lowest RSS first, at most `top` each. */
  bestBySize: Record<number, RankedSubset[]>;
  /**
   * Slices not yet done when the sweep stopped (empty when it finished); sweeping them later and merging the
   * outcomes gives the same result as an uninterrupted sweep.
   */
  remaining?: SweepSlice[];
}

/** A GramProblem and the Euclidean norms the columns of A were divided by. */
export interface FormedGramProblem {
  problem: GramProblem;
  /** Norm of each original column; coefficients of the scaled problem divided by these fit the original. */
  columnNorms: Float64Array;
}

/**
 * Forms G = A^T A, b = A^T y and y^T y with every column of A scaled to unit norm, from a row-major
 * N x m matrix whose first `knownCount` columns are the known terms. A column of zeros cannot be scaled
 * and is an error naming that column.
 */
export function formGramProblem(
  matrix: Float64Array,
  rowCount: number,
  columnCount: number,
  y: Float64Array,
  knownCount: number,
): FormedGramProblem {
  if (matrix.length !== rowCount * columnCount) {
    throw new RangeError(`the matrix must have ${rowCount} x ${columnCount} entries, got ${matrix.length}`);
  }
  if (y.length !== rowCount) throw new RangeError(`the right side must have ${rowCount} entries, got ${y.length}`);
  const m = columnCount;
  const gram = new Float64Array(m * m);
  const rhs = new Float64Array(m);
  let yty = 0;
  for (let r = 0; r < rowCount; r++) {
    const offset = r * m;
    const yr = y[r];
    yty += yr * yr;
    for (let i = 0; i < m; i++) {
      const a = matrix[offset + i];
      if (a === 0) continue;
      rhs[i] += a * yr;
      for (let j = i; j < m; j++) gram[i * m + j] += a * matrix[offset + j];
    }
  }
  const columnNorms = new Float64Array(m);
  for (let i = 0; i < m; i++) {
    const norm = Math.sqrt(gram[i * m + i]);
    if (!(norm > 0)) throw new RangeError(`column ${i} is zero on every row and cannot be scaled`);
    columnNorms[i] = norm;
  }
  for (let i = 0; i < m; i++) {
    rhs[i] /= columnNorms[i];
    for (let j = i; j < m; j++) {
      const scaled = i === j ? 1 : gram[i * m + j] / (columnNorms[i] * columnNorms[j]);
      gram[i * m + j] = scaled;
      gram[j * m + i] = scaled;
    }
  }
  return { problem: { columnCount: m, knownCount, gram, rhs, yty }, columnNorms };
}
