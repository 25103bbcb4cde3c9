import { fitComponents } from './fit-components.js';
import { mlDeviance, mlDevianceDerivative } from './ml-deviance.js';
import { nonEmptyGroups } from './non-empty-groups.js';
import type { GroupMoments, VarianceComponents } from './types.js';

/**
 * Maximum-likelihood variance components of the one-way random-intercept ("null") model, exact
 * for unbalanced groups, with σ̂² = Q/N and τ̂² ≥ 0 (0 on the boundary).
 *
 * ML is reported beside REML because its log-likelihood is the one comparable across models
 * with different fixed effects. Source: Hartley & Rao (1967), *Biometrika* 54(1–2);
 * Searle, Casella & McCulloch (1992), *Variance Components*, ch. 6.
 * Groups with n = 0 are dropped; J < 2 or N − J < 1 gives NaN components (see fitComponents).
 *
 * @param groups per-group moments
 * @returns τ², σ², ICC, GLS mean and ML log-likelihood
 * @throws on invalid moments (see nonEmptyGroups)
 */
export function mlComponents(groups: readonly GroupMoments[]): VarianceComponents {
  return fitComponents(nonEmptyGroups(groups), { deviance: mlDeviance, derivative: mlDevianceDerivative }, (n) => n);
}
