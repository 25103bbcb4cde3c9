/**
 * Sufficient statistics of one group for a pair (outcome y, predictor x), over the records where
 * both are present: everything a within-group regression of y on x needs.
 */
export interface PairMoments {
  n: number;
  meanX: number;
  meanY: number;
  /** Σ (x − x̄_j)² */
  sxx: number;
  /** Σ (y − ȳ_j)² */
  syy: number;
  /** Σ (x − x̄_j)(y − ȳ_j) */
  sxy: number;
  /** the group's position in the profile's group table (to name it), when it comes from a profile */
  index?: number;
}

/**
 * A group's pair moments from its records (for tests and small inputs), with the same two-pass
 * centring the engines' regr_* aggregates give.
 *
 * @param xs the predictor's values
 * @param ys the outcome's values, same length
 */
export function pairMomentsFromValues(xs: readonly number[], ys: readonly number[]): PairMoments {
  const n = xs.length;
  const meanX = xs.reduce((a, b) => a + b, 0) / n;
  const meanY = ys.reduce((a, b) => a + b, 0) / n;
  let sxx = 0;
  let syy = 0;
  let sxy = 0;
  for (let i = 0; i < n; i++) {
    sxx += (xs[i] - meanX) ** 2;
    syy += (ys[i] - meanY) ** 2;
    sxy += (xs[i] - meanX) * (ys[i] - meanY);
  }
  return { n, meanX, meanY, sxx, syy, sxy };
}
