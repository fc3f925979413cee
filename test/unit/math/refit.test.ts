import { expect } from 'chai';
import { Matrix, SingularValueDecomposition } from 'ml-matrix';
import { splitRankSpace } from '../../../shared/math/combinations.js';
import { buildGramProblem } from '../../../shared/math/gram-problem.js';
import { refitColumns } from '../../../shared/math/refit.js';
import { scoreFit } from '../../../shared/math/model-scores.js';
import { evaluateSlices } from '../../../shared/math/sweep-kernel.js';

const rows = 400;
/** Columns of very different sizes (as a velocity squared next to a cosine), well conditioned once scaled. */
const columns = [
  Float64Array.from({ length: rows }, (_, i) => 250 * Math.sin(0.031 * i) ** 2),
  Float64Array.from({ length: rows }, (_, i) => Math.cos(0.017 * i + 0.3)),
  Float64Array.from({ length: rows }, (_, i) => 0.004 * (i / rows) ** 3),
  Float64Array.from({ length: rows }, (_, i) => Math.sin(0.11 * i) * Math.cos(0.05 * i)),
];
const rhs = Float64Array.from({ length: rows }, (_, i) => 3 * columns[0]![i]! - 40 * columns[1]![i]! + Math.sin(1.7 * i) * 0.5);

function relativeDifference(a: number, b: number): number {
  return Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b));
}

describe('re-fit of leaderboard models', () => {
  it('gives the coefficients and RSS of an ml-matrix SVD least-squares solve to 1e-9 relative', () => {
    // Reference: ml-matrix's SVD solve, a general-purpose library (checks.md, least squares).
    const a = new Matrix(rows, columns.length);
    columns.forEach((c, j) => c.forEach((v, i) => a.set(i, j, v)));
    const reference = new SingularValueDecomposition(a, { autoTranspose: true }).solve(Matrix.columnVector(Array.from(rhs)));
    const residual = a.mmul(reference).sub(Matrix.columnVector(Array.from(rhs)));
    const referenceRss = residual.to1DArray().reduce((s, r) => s + r * r, 0);

    const fit = refitColumns(columns, rhs);
    fit.coefficients.forEach((c, j) => expect(relativeDifference(c, reference.get(j, 0)), `coefficient ${j}`).to.be.below(1e-9));
    expect(relativeDifference(fit.rss, referenceRss)).to.be.below(1e-9);
  });

  it('reports the 2-norm condition number of the unit-norm columns, as ml-matrix computes it', () => {
    const scaled = new Matrix(rows, columns.length);
    columns.forEach((c, j) => {
      const norm = Math.hypot(...c);
      c.forEach((v, i) => scaled.set(i, j, v / norm));
    });
    const reference = new SingularValueDecomposition(scaled, { autoTranspose: true }).condition;
    expect(relativeDifference(refitColumns(columns, rhs).conditionNumber, reference)).to.be.below(1e-9);
  });

  it('agrees with the sweep kernel on the RSS of every subset of the Gram problem', () => {
    const { problem } = buildGramProblem(columns, rhs, 1);
    const outcome = evaluateSlices(problem, splitRankSpace(3, 0, 3, 100), { top: 20 });
    expect(outcome.evaluated).to.equal(8);
    for (const subset of Object.values(outcome.bestBySize).flat()) {
      const chosen = [columns[0]!, ...subset.members.map((m) => columns[1 + m]!)];
      expect(relativeDifference(refitColumns(chosen, rhs).rss, subset.rss), subset.members.join(',')).to.be.below(1e-8);
    }
  });

  it('scores a fit by RMS residual, R^2 and BIC = N ln(RSS/N) + k ln N (method.md section 3)', () => {
    const y = Float64Array.of(1, 2, 3, 4);
    const scores = scoreFit(0.5, y, 2);
    expect(scores.rmse).to.be.closeTo(Math.sqrt(0.5 / 4), 1e-15);
    expect(scores.r2).to.be.closeTo(1 - 0.5 / 5, 1e-15); // sum (y - 2.5)^2 = 5
    expect(scores.bic).to.be.closeTo(4 * Math.log(0.5 / 4) + 2 * Math.log(4), 1e-12);
  });
});
