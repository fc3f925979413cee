/**
 * Integral of sampled f over samples from..to (indices, to > from) of a possibly non-uniform grid t.
 * Trapezoid rule, or composite Simpson on pairs of intervals with the non-uniform weights; an odd interval
 * count ends with the last interval integrated under the parabola through the last three samples. Both
 * formulas: Abramowitz & Stegun 25.4.2 and 25.4.5 for the uniform case, from memory.
 */
export function windowIntegral(
  t: Float64Array,
  f: Float64Array,
  from: number,
  to: number,
  rule: 'trapezoid' | 'simpson',
): number {
  if (rule === 'trapezoid' || to - from < 2) {
    let sum = 0;
    for (let k = from; k < to; k++) sum += 0.5 * (t[k + 1]! - t[k]!) * (f[k]! + f[k + 1]!);
    return sum;
  }
  let sum = 0;
  let k = from;
  for (; k + 2 <= to; k += 2) sum += simpsonPair(t[k]!, t[k + 1]!, t[k + 2]!, f[k]!, f[k + 1]!, f[k + 2]!);
  if (k < to) sum += lastIntervalUnderParabola(t[k - 1]!, t[k]!, t[k + 1]!, f[k - 1]!, f[k]!, f[k + 1]!);
  return sum;
}

/** Integral over [t0, t2] of the parabola through three samples. */
function simpsonPair(t0: number, t1: number, t2: number, f0: number, f1: number, f2: number): number {
  const h0 = t1 - t0;
  const h1 = t2 - t1;
  const h = h0 + h1;
  return (h / 6) * ((2 - h1 / h0) * f0 + ((h * h) / (h0 * h1)) * f1 + (2 - h0 / h1) * f2);
}

/** Integral over [t1, t2] of the parabola through (t0, f0), (t1, f1), (t2, f2). */
function lastIntervalUnderParabola(t0: number, t1: number, t2: number, f0: number, f1: number, f2: number): number {
  const h0 = t1 - t0;
  const h1 = t2 - t1;
  return (
    (f2 * (2 * h1 * h1 + 3 * h0 * h1)) / (6 * (h0 + h1)) +
    (f1 * (h1 * h1 + 3 * h0 * h1)) / (6 * h0) -
    (f0 * h1 * h1 * h1) / (6 * h0 * (h0 + h1))
  );
}
