/**
 * Rows of one regression form over one or more recordings: a column per term (the term after the form is
 * applied: its time derivative, or its change over a window), the input-power side (power, or its integral
 * over each window; null when no recording carries forces), and per term a scale of the term's own values,
 * which tells a column that is zero on the data from one that is merely small.
 */
export interface FormRows {
  rowCount: number;
  columns: Float64Array[];
  power: Float64Array | null;
  /** Root mean square of each term's values on the samples the rows use. */
  valueScales: number[];
  /**
   * Turns the size of a column into the size of a change of the term's value: the mean recording duration for
   * the derivative form (whose columns are rates), 1 for the balance form (whose columns are changes).
   */
  changeScale: number;
}

/** Concatenates per-recording column pieces into one column per term. */
export function concatenate(pieces: Float64Array[]): Float64Array {
  const total = pieces.reduce((sum, piece) => sum + piece.length, 0);
  const out = new Float64Array(total);
  let offset = 0;
  for (const piece of pieces) {
    out.set(piece, offset);
    offset += piece.length;
  }
  return out;
}

export function rootMeanSquare(values: ArrayLike<number>): number {
  if (values.length === 0) return 0;
  let sum = 0;
  for (let i = 0; i < values.length; i++) sum += values[i]! * values[i]!;
  return Math.sqrt(sum / values.length);
}
