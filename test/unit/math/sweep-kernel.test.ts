import { expect } from 'chai';
import { Matrix, SingularValueDecomposition } from 'ml-matrix';
import { binomial, countSliceSubsets, countSubsets, partitionSlices, splitRankSpace } from '../../../shared/math/combinations.js';
import { buildGramProblem } from '../../../shared/math/gram-problem.js';
import { mergeSweepOutcomes } from '../../../shared/math/leaderboard.js';
import { evaluateSlices } from '../../../shared/math/sweep-kernel.js';
import type { GramProblem, RankedSubset, SweepOutcome, SweepProgress } from '../../../shared/math/sweep-problem.js';
import { createNormalRandom, createSeededRandom } from '../../../shared/math/seeded-random.js';

/*
 * The reference is a plain least-squares solve of every subset on the unscaled rows with ml-matrix's
 * SingularValueDecomposition (a general-purpose library), and the subset's numerical rank from the SVD of its
 * column-normalized matrix. checks.md: same RSS to 1e-9 relative on well-conditioned problems.
 */

interface Regression {
  columns: Float64Array[];
  y: Float64Array;
  knownCount: number;
}

interface ReferenceFit {
  size: number;
  members: number[];
  rss: number;
  fullRank: boolean;
}

const TOP = 10;

function problemOf({ columns, y, knownCount }: Regression): GramProblem {
  return buildGramProblem(columns, y, knownCount).problem;
}

function subsetsOf(n: number, k: number): number[][] {
  const result: number[][] = [];
  const extend = (prefix: number[], next: number): void => {
    if (prefix.length === k) result.push(prefix);
    else for (let member = next; member < n; member++) extend([...prefix, member], member + 1);
  };
  extend([], 0);
  return result;
}

function referenceFit({ columns, y, knownCount }: Regression, members: number[]): ReferenceFit {
  const chosen = [...Array.from({ length: knownCount }, (_, i) => i), ...members.map((c) => c + knownCount)];
  const rows = y.length;
  const right = Matrix.columnVector(Array.from(y));
  if (chosen.length === 0) return { size: 0, members, rss: right.norm() ** 2, fullRank: true };
  const matrix = new Matrix(rows, chosen.length);
  const normalized = new Matrix(rows, chosen.length);
  chosen.forEach((column, j) => {
    const norm = Math.hypot(...columns[column]);
    for (let r = 0; r < rows; r++) {
      matrix.set(r, j, columns[column][r]);
      normalized.set(r, j, columns[column][r] / norm);
    }
  });
  const coefficients = new SingularValueDecomposition(matrix, { autoTranspose: true }).solve(right);
  const rss = right.sub(matrix.mmul(coefficients)).norm() ** 2;
  const rank = new SingularValueDecomposition(normalized, { autoTranspose: true }).rank;
  return { size: members.length, members, rss, fullRank: rank === chosen.length };
}

function referenceSweep(regression: Regression, maxSize: number): ReferenceFit[] {
  const candidateCount = regression.columns.length - regression.knownCount;
  const fits: ReferenceFit[] = [];
  for (let size = 0; size <= maxSize; size++) {
    for (const members of subsetsOf(candidateCount, size)) fits.push(referenceFit(regression, members));
  }
  return fits;
}

function bestOf(fits: ReferenceFit[]): ReferenceFit[] {
  return fits.filter((fit) => fit.fullRank).sort((a, b) => a.rss - b.rss).slice(0, TOP);
}

function relativeDifference(a: number, b: number): number {
  return Math.abs(a - b) / Math.max(Math.abs(b), Number.MIN_VALUE);
}

/**
 * The kernel's list must hold, position by position, the reference's best RSS values, and each listed subset
 * must be full rank with the reference RSS of that very subset. Subsets spanning the same columns space (for
 * example {sin^2, const} and {cos^2, const}) tie exactly, so membership is checked subset by subset.
 */
function expectSameBoard(actual: RankedSubset[], expected: ReferenceFit[], fits: ReferenceFit[], label: string): void {
  expect(actual.length, `${label} length`).to.equal(expected.length);
  actual.forEach((entry, i) => {
    expect(relativeDifference(entry.rss, expected[i].rss), `${label} #${i} RSS`).to.be.below(1e-9);
    const own = fits.find((fit) => fit.size === entry.size && fit.members.join() === entry.members.join());
    expect(own?.fullRank, `${label} #${i} [${entry.members}] full rank`).to.equal(true);
    expect(relativeDifference(entry.rss, own!.rss), `${label} #${i} [${entry.members}] own RSS`).to.be.below(1e-9);
  });
}

function expectMatchesReference(regression: Regression, maxSize: number): SweepOutcome {
  const candidateCount = regression.columns.length - regression.knownCount;
  const outcome = evaluateSlices(problemOf(regression), splitRankSpace(candidateCount, 0, maxSize, 1000), { top: TOP });
  const fits = referenceSweep(regression, maxSize);
  expect(outcome.evaluated, 'evaluated').to.equal(fits.filter((fit) => fit.fullRank).length);
  expect(outcome.rejected, 'rejected').to.equal(fits.filter((fit) => !fit.fullRank).length);
  expect(outcome.stopped).to.equal(false);
  expectSameBoard(outcome.best, bestOf(fits), fits, 'overall');
  for (let size = 0; size <= maxSize; size++) {
    expectSameBoard(outcome.bestBySize[size], bestOf(fits.filter((fit) => fit.size === size)), fits, `size ${size}`);
  }
  return outcome;
}

/** Random columns of different scales with y made of (up to) three of them plus noise. */
function randomRegression(seed: number, rows: number, columnCount: number, knownCount: number): Regression {
  const normal = createNormalRandom(createSeededRandom(seed));
  const columns = Array.from({ length: columnCount }, (_, j) => Float64Array.from({ length: rows }, () => 10 ** ((j % 5) - 2) * normal()));
  const weights = [0, 40, 0, 0, -3, 0, 0, 9];
  const y = Float64Array.from({ length: rows }, (_, r) => {
    let value = 0.3 * normal();
    for (let j = 0; j < Math.min(columnCount, weights.length); j++) value += weights[j] * columns[j][r];
    return value;
  });
  return { columns, y, knownCount };
}

/**
 * Columns with exact dependences: sin^2 t + cos^2 t = 1 (with a constant column), and a column equal to the
 * sum of two others; plus a nearly dependent pair (differing by 1e-3 noise) that must not be rejected.
 */
function collinearRegression(seed: number, withKnownConstant: boolean): Regression {
  const rows = 80;
  const normal = createNormalRandom(createSeededRandom(seed));
  const t = Float64Array.from({ length: rows }, (_, r) => (r * 6) / rows);
  const r3 = Float64Array.from({ length: rows }, () => normal());
  const r4 = Float64Array.from({ length: rows }, () => normal());
  const r9 = Float64Array.from({ length: rows }, () => normal());
  const constant = new Float64Array(rows).fill(1);
  const candidates = [
    t.map((x) => Math.sin(x) ** 2),
    t.map((x) => Math.cos(x) ** 2),
    t.map((x) => x),
    r3,
    r4,
    r3.map((x, r) => x + r4[r]),
    t.map((x) => x * x),
    t.map((x) => Math.sin(x)),
    r9,
    r9.map((x) => x + 1e-3 * normal()),
    t.map((x) => Math.cos(x)),
    ...(withKnownConstant ? [] : [constant]),
  ];
  const columns = withKnownConstant ? [constant, ...candidates] : candidates;
  const y = Float64Array.from({ length: rows }, (_, r) => 2 * candidates[0][r] + 0.5 * t[r] + r4[r] + 0.7 + 0.2 * normal());
  return { columns, y, knownCount: withKnownConstant ? 1 : 0 };
}

describe('sweep kernel: RSS of every subset against a least-squares library', () => {
  it('gives the same top 10 per size and overall as an SVD solve of every subset (m = 12, sizes 0..4)', () => {
    expectMatchesReference(randomRegression(11, 60, 12, 0), 4);
  });

  it('does the same with two known columns in every model (m = 12 + 2)', () => {
    expectMatchesReference(randomRegression(12, 60, 14, 2), 4);
  });

  it('rejects and counts exactly the rank-deficient subsets (sin^2 + cos^2 = 1, a sum of two columns)', () => {
    const outcome = expectMatchesReference(collinearRegression(13, false), 4);
    expect(outcome.rejected).to.be.greaterThan(0);
  });

  it('rejects subsets made deficient by a known column (constant known, sin^2 and cos^2 candidates)', () => {
    const outcome = expectMatchesReference(collinearRegression(14, true), 4);
    // Every subset holding both sin^2 (0) and cos^2 (1) is deficient next to the known constant.
    expect(outcome.rejected).to.be.at.least(1 + 9 + binomial(9, 2));
  });

  it('matches the reference for larger subsets too (m = 10 + 1 known, sizes 5..8: deeper prefixes)', () => {
    const regression = randomRegression(24, 40, 11, 1);
    const fits = referenceSweep(regression, 8).filter((fit) => fit.size >= 5);
    const outcome = evaluateSlices(problemOf(regression), splitRankSpace(10, 5, 8, 7), { top: TOP });
    expect(outcome.evaluated).to.equal(fits.length);
    expectSameBoard(outcome.best, bestOf(fits), fits, 'overall');
    for (let size = 5; size <= 8; size++) {
      expectSameBoard(outcome.bestBySize[size], bestOf(fits.filter((fit) => fit.size === size)), fits, `size ${size}`);
    }
  });

  it('keeps, for every board length K, the first K of the complete ranking', () => {
    const problem = problemOf(randomRegression(25, 40, 20, 0));
    const slices = splitRankSpace(20, 1, 4, 500);
    const everything = evaluateSlices(problem, slices, { top: countSliceSubsets(slices) });
    expect(everything.best).to.have.length(countSliceSubsets(slices));
    for (const top of [1, 2, 3, 5, 8, 13, 21, 34, 55, 89]) {
      const outcome = evaluateSlices(problem, slices, { top });
      expect(outcome.best, `top ${top}`).to.deep.equal(everything.best.slice(0, top));
    }
  });

  it('scores size 0 as one subset: y^T y without known columns', () => {
    const regression = randomRegression(15, 30, 6, 0);
    const outcome = evaluateSlices(problemOf(regression), [{ size: 0, firstRank: 0, endRank: 1 }], { top: 3 });
    const yty = regression.y.reduce((sum, value) => sum + value * value, 0);
    expect(outcome.evaluated).to.equal(1);
    expect(outcome.best).to.have.length(1);
    expect(outcome.best[0].members).to.deep.equal([]);
    expect(Math.abs(outcome.best[0].rss - yty) / yty).to.be.below(1e-12);
  });

  it('never reports a negative RSS for an exact fit', () => {
    const regression = randomRegression(16, 40, 8, 0);
    regression.y = regression.columns[2].map((x, r) => 3 * x - 5 * regression.columns[5][r]);
    const outcome = evaluateSlices(problemOf(regression), splitRankSpace(8, 1, 3, 100), { top: 5 });
    const yty = regression.y.reduce((sum, value) => sum + value * value, 0);
    expect(outcome.bestBySize[2][0].members).to.deep.equal([2, 5]);
    expect(outcome.bestBySize[2][0].rss).to.be.at.most(1e-12 * yty);
    for (const entry of Object.values(outcome.bestBySize).flat()) expect(entry.rss).to.be.at.least(0);
  });

  it('says plainly when the known columns are linearly dependent', () => {
    const base = collinearRegression(17, false);
    // Known columns sin^2, cos^2 and the constant (the last candidate) are dependent.
    const columns = [base.columns[0], base.columns[1], base.columns[11], ...base.columns.slice(2, 11)];
    expect(() => evaluateSlices(problemOf({ columns, y: base.y, knownCount: 3 }), [{ size: 0, firstRank: 0, endRank: 1 }], { top: 3 })).to.throw(
      /known terms are linearly dependent: known column 2/,
    );
  });

  it('refuses slices outside the rank space', () => {
    const problem = problemOf(randomRegression(18, 20, 5, 0));
    expect(() => evaluateSlices(problem, [{ size: 2, firstRank: 0, endRank: 11 }], { top: 3 })).to.throw(RangeError, /0 <= first <= end <= 10/);
    expect(() => evaluateSlices(problem, [{ size: 6, firstRank: 0, endRank: 1 }], { top: 3 })).to.throw(RangeError);
  });
});

describe('sweep kernel: slices, stopping and progress', () => {
  const strip = (outcome: SweepOutcome) => ({
    evaluated: outcome.evaluated,
    rejected: outcome.rejected,
    best: outcome.best,
    bestBySize: outcome.bestBySize,
  });

  it('gives identical results however the rank space is split (including starts inside deficient blocks)', () => {
    for (const regression of [collinearRegression(19, false), collinearRegression(20, true), randomRegression(21, 50, 16, 1)]) {
      const problem = problemOf(regression);
      const candidateCount = regression.columns.length - regression.knownCount;
      const whole = evaluateSlices(problem, splitRankSpace(candidateCount, 0, 5, 1e9), { top: TOP });
      for (const perSlice of [1, 3, 17, 100]) {
        const slices = splitRankSpace(candidateCount, 0, 5, perSlice);
        expect(strip(evaluateSlices(problem, slices, { top: TOP })), `slices of ${perSlice}`).to.deep.equal(strip(whole));
        const shards = partitionSlices(slices, 5).map((group) => evaluateSlices(problem, group, { top: TOP }));
        expect(strip(mergeSweepOutcomes(shards, TOP)), `5 shards of slices of ${perSlice}`).to.deep.equal(strip(whole));
      }
    }
  });

  it('gives the same results when a long run of last members is cut between clock reads (150 candidates)', () => {
    const problem = problemOf(randomRegression(26, 30, 150, 0));
    // One slice per size makes the kernel pause inside its innermost block to read the clock; slices of 100
    // subsets are too short for that, so both paths are compared.
    const whole = evaluateSlices(problem, splitRankSpace(150, 2, 3, 1e9), { top: TOP });
    const pieces = evaluateSlices(problem, splitRankSpace(150, 2, 3, 100), { top: TOP });
    expect(whole.evaluated + whole.rejected).to.equal(binomial(150, 2) + binomial(150, 3));
    expect(strip(whole)).to.deep.equal(strip(pieces));
  });

  it('stops at a checkpoint with partial results, and the remaining slices complete the sweep exactly', () => {
    const regression = randomRegression(22, 40, 30, 0);
    const problem = problemOf(regression);
    const slices = splitRankSpace(30, 3, 5, 50_000);
    const total = countSubsets(30, 3, 5);
    const full = evaluateSlices(problem, slices, { top: TOP });
    let checks = 0;
    const partial = evaluateSlices(problem, slices, { top: TOP, checkpointMs: 0, shouldStop: () => ++checks >= 2 });
    expect(partial.stopped).to.equal(true);
    expect(partial.evaluated + partial.rejected).to.be.greaterThan(0).and.below(total);
    expect(partial.evaluated + partial.rejected + countSliceSubsets(partial.remaining ?? [])).to.equal(total);
    const rest = evaluateSlices(problem, partial.remaining ?? [], { top: TOP });
    expect(rest.stopped).to.equal(false);
    expect(strip(mergeSweepOutcomes([partial, rest], TOP))).to.deep.equal(strip(full));
  });

  it('reports growing progress and ends with the final counts', () => {
    const problem = problemOf(randomRegression(23, 40, 30, 0));
    const reports: SweepProgress[] = [];
    const outcome = evaluateSlices(problem, splitRankSpace(30, 2, 4, 5000), { top: 5, checkpointMs: 0, onProgress: (p) => reports.push(p) });
    expect(reports.length).to.be.greaterThan(2);
    for (let i = 1; i < reports.length; i++) {
      expect(reports[i].evaluated + reports[i].rejected).to.be.at.least(reports[i - 1].evaluated + reports[i - 1].rejected);
    }
    expect(reports.at(-1)).to.deep.equal({ evaluated: outcome.evaluated, rejected: outcome.rejected });
    expect(outcome.evaluated + outcome.rejected).to.equal(countSubsets(30, 2, 4));
  });
});
