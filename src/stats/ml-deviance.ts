import { likelihoodTerms } from './profile-terms.js';
import type { GroupMoments } from './types.js';

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
  const { total: n, q, logDet } = likelihoodTerms(groups, lambda);
  return n * Math.log(q / n) + logDet + n * (1 + Math.log(2 * Math.PI));
}

/**
 * Derivative of the profiled ML deviance, d(−2ℓ)/dλ = N Q′/Q + Σ n_j/(1 + n_j λ).
 *
 * The optimiser uses it only to polish Brent's answer: a zero of the derivative can be located
 * to rounding level, whereas the deviance is flat to within its own rounding over a range of λ
 * about √ε wide. Note Σ n_j/(1 + n_j λ) = Σ w_j. Source: differentiation of mlDeviance;
 * Searle, Casella & McCulloch (1992), *Variance Components*, ch. 6 (ML score equations).
 *
 * @param groups non-empty per-group moments
 * @param lambda variance ratio τ²/σ² (≥ 0)
 * @returns the derivative at λ
 */
export function mlDevianceDerivative(groups: readonly GroupMoments[], lambda: number): number {
  const { total: n, q, dq, sumW } = likelihoodTerms(groups, lambda);
  return (n * dq) / q + sumW;
}
