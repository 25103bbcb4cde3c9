import { multiplicity } from './size-classes.js';
import type { GroupMoments } from './types.js';

/**
 * Total number of values, N = Σ n_j.
 *
 * Source: notation of Searle (1971), *Linear Models*, ch. 9 (one-way classification).
 *
 * @param groups per-group moments
 * @returns N
 */
export function totalCount(groups: readonly GroupMoments[]): number {
  return groups.reduce((sum, g) => sum + multiplicity(g) * g.n, 0);
}

/**
 * Grand mean of all values, ȳ = Σ n_j ȳ_j / N, so each value (not each group) counts equally.
 *
 * Source: Searle (1971), *Linear Models*, ch. 9 (one-way classification).
 *
 * @param groups per-group moments
 * @returns ȳ, or NaN when N = 0
 */
export function grandMean(groups: readonly GroupMoments[]): number {
  const n = totalCount(groups);
  return groups.reduce((sum, g) => sum + multiplicity(g) * g.n * g.mean, 0) / n;
}

/**
 * Pooled within-group sum of squares W = Σ_j ss_j (Searle 1971, one-way classification).
 *
 * @param groups per-group moments
 * @returns W
 */
export function withinSumOfSquares(groups: readonly GroupMoments[]): number {
  return groups.reduce((sum, g) => sum + g.ss, 0);
}

/**
 * Between-group sum of squares Σ n_j (ȳ_j − ȳ)² (Searle 1971, one-way classification).
 *
 * Deviations are taken from the grand mean rather than expanded as Σ n_j ȳ_j² − N ȳ², which
 * would cancel catastrophically when the means are large relative to their spread.
 *
 * @param groups per-group moments
 * @returns the between-group sum of squares
 */
export function betweenSumOfSquares(groups: readonly GroupMoments[]): number {
  const mean = grandMean(groups);
  return groups.reduce((sum, g) => sum + g.n * (g.mean - mean) ** 2, 0);
}

/**
 * Whether both variance components are estimable: at least two groups (J ≥ 2) and at least one
 * within-group degree of freedom (N − J ≥ 1); without them τ² and σ² are confounded.
 *
 * Source: Searle, Casella & McCulloch (1992), *Variance Components*, ch. 3 (the one-way
 * classification needs both mean squares to have degrees of freedom).
 *
 * @param groups non-empty per-group moments
 * @returns true when J ≥ 2 and N − J ≥ 1
 */
export function componentsEstimable(groups: readonly GroupMoments[]): boolean {
  // a size class stands for `count` groups (src/stats/size-classes.ts)
  const j = groups.reduce((sum, g) => sum + multiplicity(g), 0);
  return j >= 2 && totalCount(groups) - j >= 1;
}
