import { likelihoodTerms } from './profile-terms.js';
import type { GroupMoments } from './types.js';

/**
 * Profiled REML criterion of the one-way random-intercept model,
 * −2ℓ_R(λ) = (N−1) log(Q/(N−1)) + Σ log(1 + n_j λ) + log Σ w_j + (N−1)(1 + log 2π),
 * with σ² = Q/(N−1) profiled out.
 *
 * The log Σ w_j term is log|X′V⁻¹X| (up to σ²): it accounts for the degree of freedom spent on
 * μ, which is what makes REML σ̂² unbiased in balanced designs. Source: Searle, Casella &
 * McCulloch (1992), *Variance Components*, ch. 6; lme4's REML criterion (Bates, Mächler, Bolker &
 * Walker 2015, *J. Stat. Softw.* 67(1)).
 *
 * @param groups non-empty per-group moments (J ≥ 2, N − J ≥ 1 for a meaningful value)
 * @param lambda variance ratio τ²/σ² (≥ 0)
 * @returns the REML criterion at λ
 */
export function remlDeviance(groups: readonly GroupMoments[], lambda: number): number {
  const t = likelihoodTerms(groups, lambda);
  const dfResidual = t.total - 1;
  return dfResidual * Math.log(t.q / dfResidual) + t.logDet + Math.log(t.sumW) + dfResidual * (1 + Math.log(2 * Math.PI));
}

/**
 * Derivative of the profiled REML criterion,
 * d(−2ℓ_R)/dλ = (N−1) Q′/Q + Σ w_j − Σ w_j² / Σ w_j.
 *
 * The optimiser uses it only to polish Brent's answer: a zero of the derivative can be located
 * to rounding level, whereas the criterion is flat to within its own rounding over a range of λ
 * about √ε wide. Source: differentiation of remlDeviance (d log(1 + n_j λ)/dλ = w_j,
 * dw_j/dλ = −w_j²); Searle, Casella & McCulloch (1992), *Variance Components*, ch. 6.
 *
 * @param groups non-empty per-group moments
 * @param lambda variance ratio τ²/σ² (≥ 0)
 * @returns the derivative at λ
 */
export function remlDevianceDerivative(groups: readonly GroupMoments[], lambda: number): number {
  const t = likelihoodTerms(groups, lambda);
  return ((t.total - 1) * t.dq) / t.q + t.sumW - t.sumW2 / t.sumW;
}
