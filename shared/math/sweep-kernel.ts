import { binomial, rankSubset, unrankSubsetInto } from './combinations.js';
import { Leaderboard, mergeRankedSubsets } from './leaderboard.js';
import type { GramProblem, RankedSubset, SweepOptions, SweepOutcome, SweepSlice } from './sweep-problem.js';

/*
 * The exhaustive sweep's hot loop (method.md, section 3). For a subset S of candidates with the known terms
 * K in front, RSS(K + S) = y^T y - ||z||^2 where L z = b and L L^T = G restricted to K + S.
 *
 * 1. The known block is factored once and eliminated: what remains is the Schur complement
 *    G' = G_CC - G_CK G_KK^-1 G_KC, b' = b_C - G_CK G_KK^-1 b_K, y'y' = y^T y - ||z_K||^2, a problem over the
 *    candidates alone whose Cholesky pivots are exactly the pivots the full factor would have.
 * 2. Subsets are enumerated in lexicographic order, so consecutive subsets share a prefix c_0 < ... < c_{j}.
 *    Choosing c_j fixes row j of L for every later candidate t at once (right-looking Cholesky):
 *      l_j(t) = (G'[c_j, t] - sum_{i<j} l_i(c_j) l_i(t)) / L_jj,
 *      D_{j+1}(t) = D_j(t) - l_j(t)^2        (what is left of t's pivot),
 *      E_{j+1}(t) = E_j(t) - l_j(t) z_j      (what is left of t's forward-substitution value),
 *    stored per level in preallocated typed arrays and reused by every subset under that prefix.
 * 3. The last two members (a, t) are enumerated together without storing anything: for each a, the row
 *    l(t) = S[a, t] / L_aa of the prefix's Schur complement is formed from the stored rows in one pass over t,
 *    then the pivot d = D(t) - l^2, e = E(t) - l z and RSS = rss(prefix + a) - e^2/d. That is about
 *    (size + 2) multiply-adds per subset, independent of the number of rows; the division is only paid
 *    by subsets that can enter the leaderboard (e^2 >= (rss(prefix + a) - threshold) d).
 *
 * Every value depends only on the prefix, never on where a slice started, so results are bit-identical
 * however the rank space is split.
 */

/**
 * Default pivot tolerance on the unit-diagonal (column-scaled) Gram matrix. A pivot d is the squared sine of
 * the angle between a new unit column and the span of the ones before it. Rounding while forming G and
 * eliminating leaves d of an exactly dependent set at about 1e-16..1e-13 (it grows roughly like sqrt(N) times
 * machine epsilon with N rows), so 1e-10 stays a thousand times above that noise even for 1e5 rows, while it
 * only rejects sets in which a column lies within 1e-5 radians of the span of the others: their normal
 * equations have a condition number above 1e10 and the coefficients would be mostly rounding noise.
 */
export const DEFAULT_PIVOT_TOLERANCE = 1e-10;

/** Work units (subsets or candidate updates) between two reads of the clock: well under a millisecond. */
const CLOCK_STRIDE = 8192;
const DEFAULT_CHECKPOINT_MS = 25;
/** Allowed distance of a scaled Gram diagonal entry from 1. */
const UNIT_DIAGONAL_SLACK = 1e-6;

/** The sweep over candidates once the known terms have been eliminated (step 1 above). */
interface ReducedProblem {
  /** m': number of candidates. */
  n: number;
  /** Row-major n x n Schur complement. */
  gram: Float64Array;
  rhs: Float64Array;
  yty: number;
}

/** Preallocated state of one sweep: per-level rows of L, leftover pivots and right sides, counters, clock. */
class SweepWorkspace {
  readonly n: number;
  readonly gram: Float64Array;
  readonly yty: number;
  readonly tolerance: number;
  /** l_j(t) at j * n + t. */
  readonly rows: Float64Array;
  /** D_k(t) at k * n + t; level 0 is the diagonal of G'. */
  readonly pivotLeft: Float64Array;
  /** E_k(t) at k * n + t; level 0 is b'. */
  readonly rhsLeft: Float64Array;
  /** RSS of the known terms plus prefix members 0..j. */
  readonly rssAfter: Float64Array;
  /** Row of the Schur complement for the next-to-last member, over the last member's candidates. */
  readonly schurRow: Float64Array;
  readonly members: Int32Array;
  /** Offset of a row of zeros in `rows`, standing in for stored rows a short prefix does not have. */
  readonly zeroRowOffset: number;
  evaluated = 0;
  rejected = 0;
  work = 0;
  stopped = false;
  private lastCheckpoint: number;
  private readonly checkpointMs: number;
  private readonly options: SweepOptions;

  constructor(reduced: ReducedProblem, maxSize: number, tolerance: number, options: SweepOptions) {
    const n = reduced.n;
    const levels = Math.max(1, maxSize);
    this.n = n;
    this.gram = reduced.gram;
    this.yty = reduced.yty;
    this.tolerance = tolerance;
    this.rows = new Float64Array((levels + 1) * n);
    this.zeroRowOffset = levels * n;
    this.pivotLeft = new Float64Array(levels * n);
    this.rhsLeft = new Float64Array(levels * n);
    for (let t = 0; t < n; t++) {
      this.pivotLeft[t] = reduced.gram[t * n + t];
      this.rhsLeft[t] = reduced.rhs[t];
    }
    this.rssAfter = new Float64Array(levels);
    this.schurRow = new Float64Array(n);
    this.members = new Int32Array(levels);
    this.options = options;
    this.checkpointMs = options.checkpointMs ?? DEFAULT_CHECKPOINT_MS;
    this.lastCheckpoint = performance.now();
  }

  /** Reads the clock; at most every checkpointMs reports progress and asks whether to stop. */
  checkpoint(): boolean {
    this.work = 0;
    const now = performance.now();
    if (now - this.lastCheckpoint < this.checkpointMs) return false;
    this.lastCheckpoint = now;
    this.reportProgress();
    if (this.options.shouldStop?.()) this.stopped = true;
    return this.stopped;
  }

  reportProgress(): void {
    this.options.onProgress?.({ evaluated: this.evaluated, rejected: this.rejected });
  }
}

/**
 * Scores every subset in the given slices and keeps the best `options.top` per size and overall.
 * Throws when the known terms are linearly dependent or the input is malformed.
 */
export function evaluateSlices(problem: GramProblem, slices: SweepSlice[], options: SweepOptions): SweepOutcome {
  const tolerance = options.pivotTolerance ?? DEFAULT_PIVOT_TOLERANCE;
  if (!(tolerance >= 0 && Number.isFinite(tolerance))) {
    throw new RangeError(`pivot tolerance must be a finite number of at least 0, got ${tolerance}`);
  }
  assertGramProblem(problem);
  const candidateCount = problem.columnCount - problem.knownCount;
  assertSlices(slices, candidateCount);
  const boards = new Map<number, Leaderboard>();
  for (const slice of slices) if (!boards.has(slice.size)) boards.set(slice.size, new Leaderboard(options.top));

  const reduced = eliminateKnownColumns(problem, tolerance);
  const maxSize = slices.reduce((largest, slice) => Math.max(largest, slice.size), 0);
  const workspace = new SweepWorkspace(reduced, maxSize, tolerance, options);
  const remaining: SweepSlice[] = [];
  for (let i = 0; i < slices.length; i++) {
    const slice = slices[i];
    if (workspace.stopped) {
      if (slice.endRank > slice.firstRank) remaining.push({ ...slice });
      continue;
    }
    const reached = sweepSlice(workspace, boards.get(slice.size)!, slice);
    if (reached < slice.endRank) remaining.push({ size: slice.size, firstRank: reached, endRank: slice.endRank });
  }
  workspace.reportProgress();

  const bestBySize: Record<number, RankedSubset[]> = {};
  for (const [size, board] of [...boards].sort(([a], [b]) => a - b)) bestBySize[size] = board.sorted();
  return {
    evaluated: workspace.evaluated,
    rejected: workspace.rejected,
    stopped: workspace.stopped,
    best: mergeRankedSubsets(Object.values(bestBySize), options.top),
    bestBySize,
    remaining,
  };
}

/** Sweeps one slice; returns the rank reached (endRank unless stopped). */
function sweepSlice(workspace: SweepWorkspace, board: Leaderboard, slice: SweepSlice): number {
  if (slice.firstRank >= slice.endRank) return slice.endRank;
  if (slice.size === 0) {
    workspace.evaluated++;
    board.offer(clampAtZero(workspace.yty), workspace.members, 0);
    return slice.endRank;
  }
  if (slice.size === 1) {
    sweepSingles(workspace, board, slice.firstRank, slice.endRank);
    return slice.endRank;
  }
  return sweepSize(workspace, board, slice.size, slice.firstRank, slice.endRank);
}

function clampAtZero(rss: number): number {
  return rss > 0 ? rss : 0;
}

/** Subsets of one candidate: rank equals the candidate's index. */
function sweepSingles(workspace: SweepWorkspace, board: Leaderboard, firstRank: number, endRank: number): void {
  const { pivotLeft, rhsLeft, tolerance, yty, members } = workspace;
  let rejected = 0;
  for (let t = firstRank; t < endRank; t++) {
    const d = pivotLeft[t];
    if (!(d >= tolerance)) {
      rejected++;
      continue;
    }
    const e = rhsLeft[t];
    let rss = yty - (e * e) / d;
    if (rss < 0) rss = 0;
    if (rss <= board.threshold) {
      members[0] = t;
      board.offer(rss, members, 1);
    }
  }
  workspace.rejected += rejected;
  workspace.evaluated += endRank - firstRank - rejected;
  workspace.work += endRank - firstRank;
}

/**
 * Subsets of size >= 2 with ranks firstRank..endRank-1. Positions 0..size-3 are prefix levels with stored
 * rows; the last two positions are enumerated together in `scoreLastTwo`.
 */
function sweepSize(workspace: SweepWorkspace, board: Leaderboard, size: number, firstRank: number, endRank: number): number {
  const n = workspace.n;
  const members = workspace.members;
  unrankSubsetInto(firstRank, n, size, members);
  const stored = size - 2;
  let rank = firstRank;
  let rebuildFrom = 0;
  let atStart = true;
  while (rank < endRank) {
    const deficientLevel = buildPrefix(workspace, rebuildFrom, stored);
    if (deficientLevel >= 0) {
      // Every subset sharing a rank-deficient prefix is rank deficient: count the whole block at once.
      const blockSize = binomial(n - 1 - members[deficientLevel], size - 1 - deficientLevel);
      const blockStart = atStart ? firstRankOfBlock(members, deficientLevel, n, size) : rank;
      const blockEnd = Math.min(blockStart + blockSize, endRank);
      workspace.rejected += blockEnd - rank;
      workspace.work += 1;
      rank = blockEnd;
      if (rank >= endRank) break;
      rebuildFrom = advance(members, deficientLevel, n, size);
    } else {
      rank += scoreLastTwo(workspace, board, stored, endRank - rank);
      if (rank >= endRank) break;
      // Paused inside the block so that the clock gets read: resume there, nothing to rebuild.
      rebuildFrom = members[size - 2] < n - 1 ? stored : advance(members, stored - 1, n, size);
    }
    atStart = false;
    if (workspace.work >= CLOCK_STRIDE && workspace.checkpoint()) return rank;
  }
  return rank;
}

/** Rank of the first subset that shares members[0..level] (its later members are the smallest possible). */
function firstRankOfBlock(members: Int32Array, level: number, n: number, size: number): number {
  const first = Array.from(members.subarray(0, size));
  for (let position = level + 1; position < size; position++) first[position] = first[position - 1] + 1;
  return rankSubset(first, n);
}

/**
 * Moves to the first subset after every subset sharing members[0..level]: increments the deepest position
 * <= level that can still grow and resets the later ones. Returns the position changed.
 */
function advance(members: Int32Array, level: number, n: number, size: number): number {
  let position = level;
  while (position >= 0 && members[position] === n - size + position) position--;
  if (position < 0) throw new Error('sweep kernel ran past the last subset of a slice');
  members[position]++;
  for (let later = position + 1; later < size; later++) members[later] = members[later - 1] + 1;
  return position;
}

/**
 * Factors prefix levels from..stored-1 for the current members: each stores its row of L and the leftover
 * pivots and right sides of every later candidate. Returns the first rank-deficient level, or -1.
 */
function buildPrefix(workspace: SweepWorkspace, from: number, stored: number): number {
  const { n, gram, rows, pivotLeft, rhsLeft, members, tolerance, rssAfter } = workspace;
  for (let level = from; level < stored; level++) {
    const chosen = members[level];
    const levelOffset = level * n;
    const pivot = pivotLeft[levelOffset + chosen];
    if (!(pivot >= tolerance)) return level;
    const inverse = 1 / Math.sqrt(pivot);
    const z = rhsLeft[levelOffset + chosen] * inverse;
    rssAfter[level] = (level === 0 ? workspace.yty : rssAfter[level - 1]) - z * z;
    const nextOffset = levelOffset + n;
    const gramRow = chosen * n;
    for (let t = chosen + 1; t < n; t++) {
      let sum = gram[gramRow + t];
      for (let i = 0; i < level; i++) sum -= rows[i * n + chosen] * rows[i * n + t];
      const l = sum * inverse;
      rows[levelOffset + t] = l;
      pivotLeft[nextOffset + t] = pivotLeft[levelOffset + t] - l * l;
      rhsLeft[nextOffset + t] = rhsLeft[levelOffset + t] - l * z;
    }
    workspace.work += (n - chosen) * (level + 1);
  }
  return -1;
}

/** Stored rows folded into the innermost loop itself; rows beyond these are subtracted in separate passes. */
const FUSED_ROWS = 4;

/**
 * The innermost loops. With the prefix (members 0..stored-1) factored, enumerates the last two members
 * (a, t) from the position in members[stored], members[stored+1], for at most `budget` subsets. For each a,
 * row a of the remaining Schur complement, S[a, t] = G'[a, t] - sum_i l_i(a) l_i(t), is formed inside the
 * loop over t from up to four stored rows (unused ones have weight 0, and x - 0 * y is exactly x); deeper
 * prefixes first subtract their other rows in separate passes. Each t then costs the pivot, the right side
 * and a multiplication: the division giving the RSS is only paid when the subset can enter the board.
 * Pauses after a row of a when the work counter calls for a clock read, and leaves the next position in
 * members (members[stored] = n - 1 when the block is done). Returns the subsets covered.
 */
function scoreLastTwo(workspace: SweepWorkspace, board: Leaderboard, stored: number, budget: number): number {
  const { n, gram, rows, pivotLeft, rhsLeft, members, tolerance, schurRow, zeroRowOffset } = workspace;
  const size = stored + 2;
  const levelOffset = stored * n;
  const prefixRss = stored === 0 ? workspace.yty : workspace.rssAfter[stored - 1];
  const offset0 = stored > 0 ? 0 : zeroRowOffset;
  const offset1 = stored > 1 ? n : zeroRowOffset;
  const offset2 = stored > 2 ? 2 * n : zeroRowOffset;
  const offset3 = stored > 3 ? 3 * n : zeroRowOffset;
  const source = stored > FUSED_ROWS ? schurRow : gram;
  let a = members[stored];
  let firstT = members[stored + 1];
  let covered = 0;
  let rejected = 0;
  let work = 0;
  let threshold = board.threshold;
  while (a < n - 1 && covered < budget) {
    const count = Math.min(n - firstT, budget - covered);
    const endT = firstT + count;
    const pivotA = pivotLeft[levelOffset + a];
    if (!(pivotA >= tolerance)) {
      rejected += count;
    } else {
      const inverse = 1 / Math.sqrt(pivotA);
      const z = rhsLeft[levelOffset + a] * inverse;
      const base = prefixRss - z * z;
      let sourceOffset = a * n;
      if (stored > FUSED_ROWS) {
        subtractDeepRows(workspace, stored, a, firstT, endT);
        sourceOffset = 0;
      }
      const w0 = rows[offset0 + a] * (stored > 0 ? 1 : 0);
      const w1 = rows[offset1 + a] * (stored > 1 ? 1 : 0);
      const w2 = rows[offset2 + a] * (stored > 2 ? 1 : 0);
      const w3 = rows[offset3 + a] * (stored > 3 ? 1 : 0);
      let cut = entryCut(base, threshold);
      for (let t = firstT; t < endT; t++) {
        const schur = source[sourceOffset + t] - w0 * rows[offset0 + t] - w1 * rows[offset1 + t] - w2 * rows[offset2 + t] - w3 * rows[offset3 + t];
        const l = schur * inverse;
        const d = pivotLeft[levelOffset + t] - l * l;
        if (!(d >= tolerance)) {
          rejected++;
          continue;
        }
        const e = rhsLeft[levelOffset + t] - l * z;
        // RSS = base - e^2/d <= threshold, tested without dividing; the exact test follows.
        if (e * e >= cut * d) {
          let rss = base - (e * e) / d;
          if (rss < 0) rss = 0;
          if (rss <= threshold) {
            members[stored] = a;
            members[stored + 1] = t;
            board.offer(rss, members, size);
            threshold = board.threshold;
            cut = entryCut(base, threshold);
          }
        }
      }
    }
    covered += count;
    work += count * (stored + 1);
    if (endT < n) {
      firstT = endT;
      break;
    }
    a++;
    firstT = a + 1;
    if (work >= CLOCK_STRIDE) break;
  }
  members[stored] = a;
  members[stored + 1] = firstT;
  workspace.rejected += rejected;
  workspace.evaluated += covered - rejected;
  workspace.work += work;
  return covered;
}

/**
 * A subset can enter the board only if base - e^2/d <= threshold, i.e. e^2 >= (base - threshold) d. The cut is
 * lowered by a margin far above the rounding of either form, so the cheap test never turns away a subset the
 * exact test would keep. +Infinity lets everything through; -Infinity (a board of length 0) gives NaN, which
 * nothing passes.
 */
function entryCut(base: number, threshold: number): number {
  return base - threshold - 1e-12 * (Math.abs(base) + Math.abs(threshold));
}

/** schurRow[t] = G'[a, t] minus the contributions of stored rows FUSED_ROWS..stored-1, for t in firstT..endT-1. */
function subtractDeepRows(workspace: SweepWorkspace, stored: number, a: number, firstT: number, endT: number): void {
  const { n, gram, rows, schurRow } = workspace;
  const gramRow = a * n;
  for (let t = firstT; t < endT; t++) schurRow[t] = gram[gramRow + t];
  for (let i = FUSED_ROWS; i < stored; i++) {
    const rowOffset = i * n;
    const weight = rows[rowOffset + a];
    for (let t = firstT; t < endT; t++) schurRow[t] -= weight * rows[rowOffset + t];
  }
}

/** Step 1: factor the known block once and return the Schur complement problem over the candidates. */
function eliminateKnownColumns(problem: GramProblem, tolerance: number): ReducedProblem {
  const m = problem.columnCount;
  const k = problem.knownCount;
  const n = m - k;
  const { gram, rhs } = problem;
  const factor = new Float64Array(k * k);
  for (let j = 0; j < k; j++) {
    for (let i = 0; i <= j; i++) {
      let sum = gram[j * m + i];
      for (let t = 0; t < i; t++) sum -= factor[j * k + t] * factor[i * k + t];
      if (i < j) {
        factor[j * k + i] = sum / factor[i * k + i];
      } else if (sum >= tolerance) {
        factor[j * k + j] = Math.sqrt(sum);
      } else {
        throw new Error(
          `The known terms are linearly dependent: known column ${j} is (nearly) a combination of the known ` +
            `columns before it (Cholesky pivot ${sum.toExponential(2)} is below the tolerance ${tolerance}).`,
        );
      }
    }
  }
  // cross = L_K^-1 G_KC (k x n) and zKnown = L_K^-1 b_K by forward substitution.
  const cross = new Float64Array(k * n);
  const zKnown = new Float64Array(k);
  for (let i = 0; i < k; i++) {
    const diagonal = factor[i * k + i];
    for (let c = 0; c < n; c++) {
      let sum = gram[i * m + k + c];
      for (let t = 0; t < i; t++) sum -= factor[i * k + t] * cross[t * n + c];
      cross[i * n + c] = sum / diagonal;
    }
    let sum = rhs[i];
    for (let t = 0; t < i; t++) sum -= factor[i * k + t] * zKnown[t];
    zKnown[i] = sum / diagonal;
  }
  const reducedGram = new Float64Array(n * n);
  const reducedRhs = new Float64Array(n);
  for (let c = 0; c < n; c++) {
    for (let d = 0; d < n; d++) {
      let sum = gram[(k + c) * m + k + d];
      for (let i = 0; i < k; i++) sum -= cross[i * n + c] * cross[i * n + d];
      reducedGram[c * n + d] = sum;
    }
    let sum = rhs[k + c];
    for (let i = 0; i < k; i++) sum -= cross[i * n + c] * zKnown[i];
    reducedRhs[c] = sum;
  }
  let yty = problem.yty;
  for (let i = 0; i < k; i++) yty -= zKnown[i] * zKnown[i];
  return { n, gram: reducedGram, rhs: reducedRhs, yty };
}

function assertGramProblem(problem: GramProblem): void {
  const { columnCount: m, knownCount: k, gram, rhs, yty } = problem;
  if (!Number.isInteger(m) || m < 0) throw new RangeError(`column count must be a whole number, got ${m}`);
  if (!Number.isInteger(k) || k < 0 || k > m) throw new RangeError(`known count must be in 0..${m}, got ${k}`);
  if (gram.length !== m * m) throw new RangeError(`the Gram matrix must have ${m * m} entries, got ${gram.length}`);
  if (rhs.length !== m) throw new RangeError(`the right side must have ${m} entries, got ${rhs.length}`);
  if (!Number.isFinite(yty) || yty < 0) throw new RangeError(`y^T y must be a finite number >= 0, got ${yty}`);
  for (let i = 0; i < gram.length; i++) {
    if (!Number.isFinite(gram[i])) throw new RangeError(`the Gram matrix has a non-finite entry at ${i}`);
  }
  for (let i = 0; i < m; i++) {
    if (!Number.isFinite(rhs[i])) throw new RangeError(`the right side has a non-finite entry at ${i}`);
    if (Math.abs(gram[i * m + i] - 1) > UNIT_DIAGONAL_SLACK) {
      throw new RangeError(`column ${i} is not scaled to unit norm (Gram diagonal ${gram[i * m + i]})`);
    }
  }
}

function assertSlices(slices: readonly SweepSlice[], candidateCount: number): void {
  for (const { size, firstRank, endRank } of slices) {
    if (!Number.isInteger(size) || size < 0 || size > candidateCount) {
      throw new RangeError(`slice size must be in 0..${candidateCount}, got ${size}`);
    }
    const total = binomial(candidateCount, size);
    if (!Number.isSafeInteger(firstRank) || !Number.isSafeInteger(endRank) || firstRank < 0 || firstRank > endRank || endRank > total) {
      throw new RangeError(`slice ranks must satisfy 0 <= first <= end <= ${total} for size ${size}, got ${firstRank}..${endRank}`);
    }
  }
}
