import { Matrix, QrDecomposition, SingularValueDecomposition } from 'ml-matrix';

/** A least-squares fit of a right side on some columns, on the original (unscaled) columns. */
export interface ColumnFit {
  coefficients: number[];
  /** Residual sum of squares ||A c - y||^2, computed from the residual itself. */
  rss: number;
  /**
   * 2-norm condition number of the fitted columns after scaling each to unit length: how nearly dependent
   * the terms are on the data, free of their units. 1 for an empty or single-column fit.
   */
  conditionNumber: number;
}

/**
 * Re-fits on the original columns (method.md section 3): a Householder QR solve (ml-matrix) of the columns
 * scaled to unit norm, the coefficients scaled back. Scaling changes nothing in exact arithmetic but keeps
 * the QR away from columns of wildly different size (a velocity squared next to a cosine).
 */
export function refitColumns(columns: readonly Float64Array[], rhs: Float64Array): ColumnFit {
  if (columns.length === 0) return { coefficients: [], rss: sumOfSquares(rhs), conditionNumber: 1 };
  const rows = rhs.length;
  const scales = columns.map((column) => Math.sqrt(sumOfSquares(column)));
  const a = new Matrix(rows, columns.length);
  columns.forEach((column, j) => {
    for (let i = 0; i < rows; i++) a.set(i, j, column[i]! / scales[j]!);
  });
  const qr = new QrDecomposition(a);
  const solution = qr.solve(Matrix.columnVector(Array.from(rhs)));
  const coefficients = columns.map((_, j) => solution.get(j, 0) / scales[j]!);
  const conditionNumber = columns.length === 1 ? 1 : new SingularValueDecomposition(qr.upperTriangularMatrix).condition;
  return { coefficients, rss: residualSumOfSquares(columns, coefficients, rhs), conditionNumber };
}

/** ||sum_j c_j a_j - y||^2. */
export function residualSumOfSquares(columns: readonly Float64Array[], coefficients: readonly number[], rhs: Float64Array): number {
  let sum = 0;
  for (let i = 0; i < rhs.length; i++) {
    let r = -rhs[i]!;
    for (let j = 0; j < columns.length; j++) r += coefficients[j]! * columns[j]![i]!;
    sum += r * r;
  }
  return sum;
}

function sumOfSquares(values: Float64Array): number {
  let sum = 0;
  for (let i = 0; i < values.length; i++) sum += values[i]! * values[i]!;
  return sum;
}
