/** How well a fit explains its right side, by the usual least-squares scores. */
export interface FitScores {
  /** sqrt(RSS / N). */
  rmse: number;
  /** 1 - RSS / sum (y - mean y)^2; null when the right side is constant. */
  r2: number | null;
  /** Bayesian information criterion N ln(RSS / N) + k ln N (method.md section 3); lower is better. */
  bic: number;
}

/**
 * Scores a fit with k fitted coefficients on N rows. RSS is floored at 1e-30 y^T y so an exact fit gives a
 * finite criterion instead of minus infinity.
 */
export function scoreFit(rss: number, rhs: Float64Array, fittedCount: number): FitScores {
  const n = rhs.length;
  let mean = 0;
  for (let i = 0; i < n; i++) mean += rhs[i]!;
  mean /= n;
  let total = 0;
  let yty = 0;
  for (let i = 0; i < n; i++) {
    total += (rhs[i]! - mean) ** 2;
    yty += rhs[i]! ** 2;
  }
  const floor = Math.max(1e-30 * yty, Number.MIN_VALUE);
  return {
    rmse: Math.sqrt(rss / n),
    r2: total > 0 ? 1 - rss / total : null,
    bic: n * Math.log(Math.max(rss, floor) / n) + fittedCount * Math.log(n),
  };
}
