import normalCdf from '@stdlib/stats-base-dists-normal-cdf';

/** What one delivery's ANOVA gives for the comparison of its ICC(1) with another's. */
export interface IccAnova {
  icc: number | null;
  n0: number;
  df1: number;
  df2: number;
}

/**
 * Whether two independent ANOVA ICC(1)s differ by more than sampling explains: a z-test on
 * Fisher's transformation of the intraclass correlation, z = ½ ln[(1 + (k − 1) r) / (1 − r)]
 * (Fisher, R. A. 1925, *Statistical Methods for Research Workers*, §40), whose variance is that of
 * Fisher's z = ½ ln F, ½ (1/ν₁ + 1/ν₂) (Fisher 1924, "On a distribution yielding the error
 * functions of several well known statistics"); recalled from memory. For the ANOVA estimator
 * r = (F − 1)/(F + k − 1) the transform is ½ ln F exactly when k = n0.
 * Assumptions: normal outcomes; groups near balanced (k is the n0 of both deliveries, averaged,
 * so that the same ρ maps to the same z); two independent deliveries. Deliveries that share groups
 * are positively correlated, which makes the test conservative.
 *
 * @returns z, two-sided p; NaN when either ICC is missing or at or beyond its bounds
 */
export function iccDifference(previous: IccAnova, current: IccAnova): { z: number; p: number } {
  const k = (previous.n0 + current.n0) / 2;
  const transform = (r: number) => 0.5 * Math.log((1 + (k - 1) * r) / (1 - r));
  const variance = (a: IccAnova) => 0.5 * (1 / a.df1 + 1 / a.df2);
  const r1 = previous.icc;
  const r2 = current.icc;
  const usable = (r: number | null): r is number => r !== null && Number.isFinite(r) && r < 1 && 1 + (k - 1) * r > 0;
  if (!usable(r1) || !usable(r2) || !(k > 1)) return { z: Number.NaN, p: Number.NaN };
  const z = (transform(r2) - transform(r1)) / Math.sqrt(variance(previous) + variance(current));
  return { z, p: 2 * (1 - normalCdf(Math.abs(z), 0, 1)) };
}
