import { nonEmptyGroups } from './non-empty-groups.js';
import type { GroupMoments } from './types.js';

/**
 * Reliability of one group's observed mean as an estimate of its true mean,
 * λ_j = τ² / (τ² + σ²/n_j).
 *
 * Source: Raudenbush & Bryk (2002), *Hierarchical Linear Models* (2nd ed.), eq. 3.58.
 *
 * @param tau2 between-group variance τ²
 * @param sigma2 within-group variance σ²
 * @param n group size n_j
 * @returns the reliability in [0, 1]
 */
export function groupMeanReliability(tau2: number, sigma2: number, n: number): number {
  return tau2 / (tau2 + sigma2 / n);
}

/**
 * Average over groups of the group-mean reliability τ² / (τ² + σ²/n_j), the summary
 * Raudenbush & Bryk report for the unconditional model.
 *
 * Source: Raudenbush & Bryk (2002), *Hierarchical Linear Models* (2nd ed.), eq. 3.58 and
 * Table 4.2. Groups with n = 0 are dropped; no groups gives NaN.
 *
 * @param groups per-group moments (only n is used)
 * @param tau2 between-group variance τ² (REML in this tool)
 * @param sigma2 within-group variance σ² (REML in this tool)
 * @returns the mean reliability
 * @throws on invalid moments (see nonEmptyGroups)
 */
export function meanReliability(groups: readonly GroupMoments[], tau2: number, sigma2: number): number {
  const kept = nonEmptyGroups(groups);
  const total = kept.reduce((sum, g) => sum + groupMeanReliability(tau2, sigma2, g.n), 0);
  return total / kept.length;
}
