import { SINGULAR_PIVOT_TOLERANCE } from '../math/dense-solve.js';
import type { ModelDocument } from '../schemas/model-document.js';
import { expressionCode, type CodeDialect } from './expression-code.js';
import { arraySymbolReader, headerCommentLines } from './generated-code-parts.js';
import { documentEquations } from './model-document.js';

const dialect: CodeDialect = { number: (x) => String(x), sin: 'Math.sin', cos: 'Math.cos', integerPower: 'integerPower' };

/**
 * A self-contained TypeScript module (no imports) exporting `coordinates`, `massMatrix(q, dq)`,
 * `forceVector(q, dq, u)` and `accelerations(q, dq, u): number[]`, which throws where the mass matrix is
 * singular to working precision. Strict-mode clean. Pure: returns the text.
 */
export function exportTypeScript(document: ModelDocument): string {
  const equations = documentEquations(document);
  const n = equations.coordinates.length;
  const read = arraySymbolReader(equations, '!');
  const code = (tree: Parameters<typeof expressionCode>[0]) => expressionCode(tree, dialect, read);
  const rows = equations.massMatrix.map((row) => `    ${row.map(code).join(', ')},`);
  const forces = equations.forceVector.map((entry) => `    ${code(entry)},`);
  return `${headerCommentLines(document, '//', 'a TypeScript module').join('\n')}

/** Coordinate names in argument order. */
export const coordinates: readonly string[] = ${JSON.stringify(equations.coordinates)};

/** x^n by repeated squaring, the same steps as the product uses. */
function integerPower(x: number, n: number): number {
  let result = 1;
  let base = x;
  for (let m = Math.abs(n); m > 0; m >>= 1) {
    if (m & 1) result *= base;
    base *= base;
  }
  return n < 0 ? 1 / result : result;
}

/** The mass matrix M(q, dq), row-major, ${n} x ${n}. */
export function massMatrix(q: readonly number[], dq: readonly number[]): number[] {
  void q;
  void dq;
  return [
${rows.join('\n')}
  ];
}

/** The force vector f(q, dq, u). */
export function forceVector(q: readonly number[], dq: readonly number[], u: readonly number[]): number[] {
  void q;
  void dq;
  void u;
  return [
${forces.join('\n')}
  ];
}

/** ddq = M(q, dq)^-1 f(q, dq, u), by Gaussian elimination with partial pivoting; throws where M is singular. */
export function accelerations(q: readonly number[], dq: readonly number[], u: readonly number[]): number[] {
  const n = ${n};
  if (q.length !== n || dq.length !== n || u.length !== n) throw new Error(\`accelerations: q, dq and u need \${n} entries each\`);
  const a = massMatrix(q, dq);
  const b = forceVector(q, dq, u);
  let scale = 0;
  for (const entry of a) scale = Math.max(scale, Math.abs(entry));
  if (!(scale > 0) || !Number.isFinite(scale)) throw new Error('accelerations: the mass matrix is zero or not finite');
  for (let col = 0; col < n; col++) {
    let pivotRow = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(a[r * n + col]!) > Math.abs(a[pivotRow * n + col]!)) pivotRow = r;
    if (!(Math.abs(a[pivotRow * n + col]!) > ${SINGULAR_PIVOT_TOLERANCE} * scale)) {
      throw new Error('accelerations: the mass matrix is singular at this state');
    }
    if (pivotRow !== col) {
      for (let c = col; c < n; c++) [a[col * n + c], a[pivotRow * n + c]] = [a[pivotRow * n + c]!, a[col * n + c]!];
      [b[col], b[pivotRow]] = [b[pivotRow]!, b[col]!];
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
  return b;
}
`;
}
