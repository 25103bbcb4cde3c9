import { remlComponents } from './reml-components.js';
import type { GroupMoments } from './types.js';

/**
 * The REML ICC of the null model refitted without one group: how much that group alone moves
 * the estimate. Each refit is exact and costs one fit over J − 1 groups, so callers ask only for
 * a bounded set of groups. Source: the case-deletion diagnostics of Cook (1977), *Technometrics*
 * 19(1), applied to a variance component; Langford & Lewis (1998), *JRSS A* 161(2), 121–160,
 * on deleting level-2 units in multilevel models.
 *
 * @param groups per-group moments (n ≥ 1)
 * @param index the group left out
 * @returns the ICC without it (NaN when the rest cannot be fitted)
 */
export function leaveOneOutIcc(groups: readonly GroupMoments[], index: number): number {
  return remlComponents(groups.filter((_, j) => j !== index)).icc;
}
