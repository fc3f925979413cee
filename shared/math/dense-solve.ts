/**
 * A pivot this small against the largest entry of the matrix counts as zero: the matrix is singular to working
 * precision (common practice, no source: a few hundred units of rounding). The exported code uses the same rule.
 */
export const SINGULAR_PIVOT_TOLERANCE = 1e-13;

/**
 * Solves the n x n system A x = b in place by Gaussian elimination with partial pivoting (the textbook
 * algorithm; the matrices here are a few rows, where it is as good as any). `a` is row-major and is destroyed;
 * `b` receives the solution. Returns the size of the smallest pivot, a cheap measure of how near A is to
 * singular; returns 0, leaving both destroyed, when a pivot is not above SINGULAR_PIVOT_TOLERANCE times the
 * largest entry of A (or A is zero or not finite). Allocates nothing.
 */
export function solveInPlace(a: Float64Array, b: Float64Array, n: number): number {
  let scale = 0;
  for (let i = 0; i < n * n; i++) scale = Math.max(scale, Math.abs(a[i]!));
  if (!(scale > 0) || !Number.isFinite(scale)) return 0;
  const tolerance = SINGULAR_PIVOT_TOLERANCE * scale;
  let smallestPivot = Infinity;
  for (let col = 0; col < n; col++) {
    let pivotRow = col;
    let pivotSize = Math.abs(a[col * n + col]!);
    for (let r = col + 1; r < n; r++) {
      const size = Math.abs(a[r * n + col]!);
      if (size > pivotSize) {
        pivotSize = size;
        pivotRow = r;
      }
    }
    if (!(pivotSize > tolerance)) return 0;
    smallestPivot = Math.min(smallestPivot, pivotSize);
    if (pivotRow !== col) {
      for (let c = col; c < n; c++) {
        const t = a[col * n + c]!;
        a[col * n + c] = a[pivotRow * n + c]!;
        a[pivotRow * n + c] = t;
      }
      const t = b[col]!;
      b[col] = b[pivotRow]!;
      b[pivotRow] = t;
    }
    const pivot = a[col * n + col]!;
    for (let r = col + 1; r < n; r++) {
      const factor = a[r * n + col]! / pivot;
      if (factor === 0) continue;
      for (let c = col + 1; c < n; c++) a[r * n + c] = a[r * n + c]! - factor * a[col * n + c]!;
      b[r] = b[r]! - factor * b[col]!;
    }
  }
  for (let r = n - 1; r >= 0; r--) {
    let sum = b[r]!;
    for (let c = r + 1; c < n; c++) sum -= a[r * n + c]! * b[c]!;
    b[r] = sum / a[r * n + r]!;
  }
  return smallestPivot;
}
