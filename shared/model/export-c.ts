import { SINGULAR_PIVOT_TOLERANCE } from '../math/dense-solve.js';
import type { ModelDocument } from '../schemas/model-document.js';
import { expressionCode, floatLiteral, type CodeDialect } from './expression-code.js';
import { arraySymbolReader, headerCommentLines } from './generated-code-parts.js';
import { documentEquations } from './model-document.js';

const dialect: CodeDialect = { number: floatLiteral, sin: 'sin', cos: 'cos', integerPower: 'conserva_ipow' };

/**
 * Self-contained C99 source (only <math.h>) with
 *   int conserva_accelerations(const double *q, const double *dq, const double *u, double *ddq)
 * which fills ddq from the model's equations of motion and returns 0, or returns 1 (ddq untouched) where the
 * mass matrix is singular to working precision. The system is solved by Gaussian elimination with partial
 * pivoting, with the same singularity rule as the product (dense-solve.ts). Pure: returns the text.
 */
export function exportC(document: ModelDocument): string {
  const equations = documentEquations(document);
  const n = equations.coordinates.length;
  const read = arraySymbolReader(equations);
  const code = (tree: Parameters<typeof expressionCode>[0]) => expressionCode(tree, dialect, read);
  const massLines = equations.massMatrix.flatMap((row, i) => row.map((entry, k) => `  m[${i * n + k}] = ${code(entry)};`));
  const forceLines = equations.forceVector.map((entry, i) => `  f[${i}] = ${code(entry)};`);
  const usesPower = [...massLines, ...forceLines].some((line) => line.includes(`${dialect.integerPower}(`));
  return `/*
${headerCommentLines(document, ' *', 'C99').join('\n')}
 *
 * Compile with any C99 compiler and link the math library (cc -std=c99 -c model.c, then -lm).
 */
#include <math.h>

#define CONSERVA_COORDINATES ${n}
${usesPower ? powerHelper : ''}
/* Solves a x = b (n x n, row-major) in place; returns 1 when a pivot falls below the singularity tolerance. */
static int conserva_solve(double *a, double *b, int n) {
  double scale = 0.0;
  int i, r, c, col;
  for (i = 0; i < n * n; i++) scale = fabs(a[i]) > scale ? fabs(a[i]) : scale;
  if (!(scale > 0.0) || !isfinite(scale)) return 1;
  for (col = 0; col < n; col++) {
    int pivot_row = col;
    double pivot_size = fabs(a[col * n + col]);
    double pivot;
    for (r = col + 1; r < n; r++) {
      if (fabs(a[r * n + col]) > pivot_size) {
        pivot_size = fabs(a[r * n + col]);
        pivot_row = r;
      }
    }
    if (!(pivot_size > ${floatLiteral(SINGULAR_PIVOT_TOLERANCE)} * scale)) return 1;
    if (pivot_row != col) {
      double t;
      for (c = col; c < n; c++) {
        t = a[col * n + c];
        a[col * n + c] = a[pivot_row * n + c];
        a[pivot_row * n + c] = t;
      }
      t = b[col];
      b[col] = b[pivot_row];
      b[pivot_row] = t;
    }
    pivot = a[col * n + col];
    for (r = col + 1; r < n; r++) {
      double factor = a[r * n + col] / pivot;
      if (factor == 0.0) continue;
      for (c = col + 1; c < n; c++) a[r * n + c] -= factor * a[col * n + c];
      b[r] -= factor * b[col];
    }
  }
  for (r = n - 1; r >= 0; r--) {
    double sum = b[r];
    for (c = r + 1; c < n; c++) sum -= a[r * n + c] * b[c];
    b[r] = sum / a[r * n + r];
  }
  return 0;
}

/* Fills m with the mass matrix M(q, dq), row-major. */
void conserva_mass_matrix(const double *q, const double *dq, double *m) {
  (void)q;
  (void)dq;
${massLines.join('\n')}
}

/* Fills f with the force vector f(q, dq, u). */
void conserva_force_vector(const double *q, const double *dq, const double *u, double *f) {
  (void)q;
  (void)dq;
  (void)u;
${forceLines.join('\n')}
}

/* ddq = M(q, dq)^-1 f(q, dq, u). Returns 0, or 1 where the mass matrix is singular (ddq is then left as it was). */
int conserva_accelerations(const double *q, const double *dq, const double *u, double *ddq) {
  double m[CONSERVA_COORDINATES * CONSERVA_COORDINATES];
  double f[CONSERVA_COORDINATES];
  int i;
  conserva_mass_matrix(q, dq, m);
  conserva_force_vector(q, dq, u, f);
  if (conserva_solve(m, f, CONSERVA_COORDINATES)) return 1;
  for (i = 0; i < CONSERVA_COORDINATES; i++) ddq[i] = f[i];
  return 0;
}
`;
}

const powerHelper = `
/* x^n by repeated squaring, the same steps as the product uses. */
static double conserva_ipow(double x, int n) {
  double result = 1.0;
  double base = x;
  int magnitude = n < 0 ? -n : n;
  while (magnitude > 0) {
    if (magnitude & 1) result *= base;
    base *= base;
    magnitude >>= 1;
  }
  return n < 0 ? 1.0 / result : result;
}
`;
