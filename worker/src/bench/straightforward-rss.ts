import { Matrix, QrDecomposition } from 'ml-matrix';

/**
 * RSS of the least-squares fit of y on the given columns, the way one would do it without the sweep kernel:
 * copy the N x k reduced matrix, solve it by QR (ml-matrix), form the residual over all N rows.
 */
export function straightforwardRss(columns: readonly Float64Array[], y: Float64Array, chosen: readonly number[]): number {
  const rowCount = y.length;
  if (chosen.length === 0) return y.reduce((sum, value) => sum + value * value, 0);
  const reduced = new Matrix(rowCount, chosen.length);
  chosen.forEach((column, j) => {
    for (let r = 0; r < rowCount; r++) reduced.set(r, j, columns[column][r]);
  });
  const right = Matrix.columnVector(Array.from(y));
  const coefficients = new QrDecomposition(reduced).solve(right);
  const residual = right.sub(reduced.mmul(coefficients));
  let rss = 0;
  for (let r = 0; r < rowCount; r++) rss += residual.get(r, 0) ** 2;
  return rss;
}
