import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import type { GroupMoments } from './types.js';

/** The index of dispersion pooled over groups, against its χ² reference. */
export interface PooledDispersion {
  /** D = Σ_j Σ_i (y_ij − ȳ_j)² / ȳ_j */
  statistic: number;
  /** Σ_j (n_j − 1) over the groups with ȳ_j > 0 */
  df: number;
  /** D / df: about 1 for Poisson counts, above 1 when the counts vary more than a Poisson's */
  ratio: number;
  /** P(χ²_df ≥ D) */
  p: number;
}

/**
 * Fisher's index of dispersion within groups, pooled: D = Σ_j SS_j / ȳ_j. Given the group means,
 * Poisson counts give D ≈ χ² on Σ_j (n_j − 1) degrees of freedom; a group whose counts are all 0
 * has no dispersion to measure and is left out of both. Within groups, so that between-group
 * variation (the random intercept's job) is not mistaken for overdispersion of the records.
 *
 * Source: Fisher, R. A. (1950). The significance of deviations from expectation in a Poisson
 * series. *Biometrics, 6*(1), 17–24 (the index of dispersion and its χ² reference); Cochran, W. G.
 * (1954). Some methods for strengthening the common χ² tests. *Biometrics, 10*(4), 417–451
 * (its pooling over several samples).
 *
 * @param groups per-group moments of the counts
 * @returns D, its df, D/df and the upper-tail p; NaN when no group has n_j > 1 and ȳ_j > 0
 */
export function pooledDispersion(groups: readonly GroupMoments[]): PooledDispersion {
  let statistic = 0;
  let df = 0;
  for (const g of groups) {
    if (!(g.mean > 0) || g.n < 1) continue;
    statistic += g.ss / g.mean;
    df += g.n - 1;
  }
  if (df === 0) return { statistic: NaN, df: 0, ratio: NaN, p: NaN };
  return { statistic, df, ratio: statistic / df, p: 1 - chisquareCdf(statistic, df) };
}
