import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';

/** Pearson's test that a share (e.g. of missing values) is equal across groups. */
export interface HomogeneityTest {
  statistic: number;
  df: number;
  p: number;
  /** groups that entered the test (those with at least one record) */
  groups: number;
}

/**
 * Pearson's chi-square test of homogeneity for a 2 × J table (event / no event by group),
 * X² = Σ_j Σ_c (O_jc − E_jc)² / E_jc on J − 1 df, E_jc = n_j · (column total / N).
 *
 * Source: Agresti, A. (2013). *Categorical Data Analysis* (3rd ed.), §3.2 (Pearson
 * chi-squared test of independence). The upper tail comes from the kept library
 * @stdlib/stats-base-dists-chisquare-cdf. With expected counts below 5 the chi-square
 * approximation is rough (Cochran's rule), which callers should say.
 *
 * @param groups per group its size n_j and event count k_j (0 ≤ k_j ≤ n_j)
 * @returns X², df, p; p = 1 with no variation (every group all events or none), NaN with fewer than two groups
 * @example
 * chiSquareHomogeneity([{ n: 10, events: 5 }, { n: 10, events: 5 }]).statistic; // => 0
 */
export function chiSquareHomogeneity(groups: readonly { n: number; events: number }[]): HomogeneityTest {
  const kept = groups.filter((g) => g.n > 0);
  const total = kept.reduce((s, g) => s + g.n, 0);
  const events = kept.reduce((s, g) => s + g.events, 0);
  const df = kept.length - 1;
  if (df < 1) return { statistic: NaN, df, p: NaN, groups: kept.length };
  if (events === 0 || events === total) return { statistic: 0, df, p: 1, groups: kept.length };
  const share = events / total;
  let statistic = 0;
  for (const g of kept) {
    const expectedEvents = g.n * share;
    const expectedOthers = g.n - expectedEvents;
    statistic += (g.events - expectedEvents) ** 2 / expectedEvents + (g.n - g.events - expectedOthers) ** 2 / expectedOthers;
  }
  return { statistic, df, p: 1 - chisquareCdf(statistic, df), groups: kept.length };
}
