import type { GramProblem } from '../math/sweep-problem.js';

/**
 * What the prepare step stores for the shards besides the matrix itself. JSON numbers round-trip doubles
 * exactly, so scales and y^T y survive storage bit for bit.
 */
export interface ProblemMeta {
  columnCount: number;
  knownCount: number;
  yty: number;
  /** Norms of the training columns, by which the Gram problem was scaled. */
  scales: number[];
  /** Canonical texts of the training columns (known terms first, then the candidates swept). */
  terms: string[];
  /** The reference term with its fixed coefficient, appended to every model; null with forced data. */
  reference: { term: string; coefficient: number } | null;
  rowCount: number;
  /** The sizes actually swept. */
  sizes: { min: number; max: number };
}

/** The Gram matrix (row-major, m x m) followed by the right side (m), as little-endian float64 bytes. */
export function encodeProblemData(problem: GramProblem): Uint8Array {
  const m = problem.columnCount;
  const bytes = new Uint8Array((m * m + m) * 8);
  const view = new DataView(bytes.buffer);
  problem.gram.forEach((value, i) => view.setFloat64(i * 8, value, true));
  problem.rhs.forEach((value, i) => view.setFloat64((m * m + i) * 8, value, true));
  return bytes;
}

/** The Gram problem back from its stored parts; refuses data whose length does not fit the column count. */
export function decodeProblem(meta: ProblemMeta, data: Uint8Array): GramProblem {
  const m = meta.columnCount;
  if (data.byteLength !== (m * m + m) * 8) {
    throw new RangeError(`stored problem data has ${data.byteLength} bytes, expected ${(m * m + m) * 8} for ${m} columns`);
  }
  const view = new DataView(data.buffer, data.byteOffset, data.byteLength);
  const gram = new Float64Array(m * m);
  const rhs = new Float64Array(m);
  for (let i = 0; i < m * m; i++) gram[i] = view.getFloat64(i * 8, true);
  for (let i = 0; i < m; i++) rhs[i] = view.getFloat64((m * m + i) * 8, true);
  return { columnCount: m, knownCount: meta.knownCount, gram, rhs, yty: meta.yty };
}
