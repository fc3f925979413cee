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
