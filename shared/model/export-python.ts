import { SINGULAR_PIVOT_TOLERANCE } from '../math/dense-solve.js';
import type { ModelDocument } from '../schemas/model-document.js';
import { expressionCode, floatLiteral, type CodeDialect } from './expression-code.js';
import { arraySymbolReader, headerCommentLines } from './generated-code-parts.js';
import { documentEquations } from './model-document.js';

const dialect: CodeDialect = { number: floatLiteral, sin: 'math.sin', cos: 'math.cos', integerPower: '_integer_power' };

/**
 * A self-contained Python 3 module (standard `math` only, no numpy) with `COORDINATES`, `mass_matrix(q, dq)`,
 * `force_vector(q, dq, u)` and `accelerations(q, dq, u)`, which returns a list and raises SingularMassMatrix
 * where the mass matrix is singular to working precision. Pure: returns the text.
 */
export function exportPython(document: ModelDocument): string {
  const equations = documentEquations(document);
  const n = equations.coordinates.length;
  const read = arraySymbolReader(equations);
  const code = (tree: Parameters<typeof expressionCode>[0]) => expressionCode(tree, dialect, read);
  const rows = equations.massMatrix.flatMap((row) => row.map((entry) => `        ${code(entry)},`));
  const forces = equations.forceVector.map((entry) => `        ${code(entry)},`);
  return `${headerCommentLines(document, '#', 'a Python module').join('\n')}

import math

COORDINATES = (${equations.coordinates.map((c) => JSON.stringify(c)).join(', ')},)


class SingularMassMatrix(ArithmeticError):
    """The mass matrix is singular (or not finite) at the state asked for."""


def _integer_power(x, n):
    # x^n by repeated squaring, the same steps as the product uses.
    result = 1.0
    base = x
    m = abs(n)
    while m > 0:
        if m & 1:
            result *= base
        base *= base
        m >>= 1
    return 1.0 / result if n < 0 else result


def mass_matrix(q, dq):
    """The mass matrix M(q, dq), row-major, ${n} x ${n}."""
    return [
${rows.join('\n')}
    ]


def force_vector(q, dq, u):
    """The force vector f(q, dq, u)."""
    return [
${forces.join('\n')}
    ]


def accelerations(q, dq, u):
    """ddq = M(q, dq)^-1 f(q, dq, u) by Gaussian elimination with partial pivoting."""
    n = ${n}
    a = mass_matrix(q, dq)
    b = force_vector(q, dq, u)
    scale = max(abs(entry) for entry in a)
    if not (scale > 0.0) or not math.isfinite(scale):
        raise SingularMassMatrix("the mass matrix is zero or not finite")
    for col in range(n):
        pivot_row = col
        for r in range(col + 1, n):
            if abs(a[r * n + col]) > abs(a[pivot_row * n + col]):
                pivot_row = r
        if not (abs(a[pivot_row * n + col]) > ${floatLiteral(SINGULAR_PIVOT_TOLERANCE)} * scale):
            raise SingularMassMatrix("the mass matrix is singular at this state")
        if pivot_row != col:
            for c in range(col, n):
                a[col * n + c], a[pivot_row * n + c] = a[pivot_row * n + c], a[col * n + c]
            b[col], b[pivot_row] = b[pivot_row], b[col]
        pivot = a[col * n + col]
        for r in range(col + 1, n):
            factor = a[r * n + col] / pivot
            if factor == 0.0:
                continue
            for c in range(col + 1, n):
                a[r * n + c] = a[r * n + c] - factor * a[col * n + c]
            b[r] = b[r] - factor * b[col]
    for r in range(n - 1, -1, -1):
        total = b[r]
        for c in range(r + 1, n):
            total -= a[r * n + c] * b[c]
        b[r] = total / a[r * n + r]
    return b
`;
}
