import { fitComponents } from './fit-components.js';
import { nonEmptyGroups } from './non-empty-groups.js';
import { remlDeviance, remlDevianceDerivative } from './reml-deviance.js';
import type { GroupMoments, VarianceComponents } from './types.js';

/**
 * REML variance components of the one-way random-intercept ("null") model, exact for unbalanced
 * groups, with σ̂² = Q/(N−1) and τ̂² ≥ 0 (0 on the boundary).
 *
 * REML is the default for reporting because it does not understate τ² for the degree of
 * freedom spent on μ, and it matches lme4's default fit. Source: Patterson & Thompson (1971),
 * *Biometrika* 58(3); Searle, Casella & McCulloch (1992), *Variance Components*, ch. 6.
 * Groups with n = 0 are dropped; J < 2 or N − J < 1 gives NaN components (see fitComponents).
 *
 * @param groups per-group moments
 * @returns τ², σ², ICC, GLS mean and REML log-likelihood
 * @throws on invalid moments (see nonEmptyGroups)
 */
export function remlComponents(groups: readonly GroupMoments[]): VarianceComponents {
  return fitComponents(nonEmptyGroups(groups), { deviance: remlDeviance, derivative: remlDevianceDerivative }, (n) => n - 1);
}
