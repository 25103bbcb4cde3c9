import type { GroupMoments } from './types.js';
import { logDetRatio, profiledQ } from './profile-terms.js';
import { totalCount } from './sums.js';

/**
 * Profiled ML deviance of the one-way random-intercept model,
 * −2ℓ(λ) = N log(Q/N) + Σ log(1 + n_j λ) + N(1 + log 2π), with μ and σ² = Q/N profiled out.
 *
 * Source: Searle, Casella & McCulloch (1992), *Variance Components*, ch. 6 (ML for the unbalanced
 * one-way model); the same profiled criterion lme4 minimises (Bates, Mächler, Bolker & Walker
 * 2015, *J. Stat. Softw.* 67(1)).
 *
 * @param groups non-empty per-group moments (J ≥ 2, N − J ≥ 1 for a meaningful value)
 * @param lambda variance ratio τ²/σ² (≥ 0)
 * @returns −2 × the maximised log-likelihood at λ
 */
export function mlDeviance(groups: readonly GroupMoments[], lambda: number): number {
  const n = totalCount(groups);
  const q = profiledQ(groups, lambda);
  return n * Math.log(q / n) + logDetRatio(groups, lambda) + n * (1 + Math.log(2 * Math.PI));
}
