import type { GroupMoments } from './types.js';

/**
 * Check each group's moments and return the groups that hold at least one value.
 *
 * Empty groups carry no information about either variance component, so every estimator
 * drops them first; their `mean` is not checked because an empty mean is undefined. This is
 * input checking, not a formula, so it has no citation beyond the GroupMoments definition
 * (ss_j = Σ (y_ij − ȳ_j)² ≥ 0, and 0 for a single value).
 *
 * @param groups per-group moments as supplied by the caller
 * @returns the groups with n ≥ 1, in their original order
 * @throws when n is not a non-negative integer, a mean is not finite, ss is negative or not
 *   finite, or a single-value group has a non-zero ss
 */
export function nonEmptyGroups(groups: readonly GroupMoments[]): GroupMoments[] {
  const kept: GroupMoments[] = [];
  groups.forEach((group, index) => {
    const { n, mean, ss } = group;
    if (!Number.isInteger(n) || n < 0) {
      throw new Error(`groups[${index}].n must be a non-negative integer, got ${n}`);
    }
    if (n === 0) return;
    if (!Number.isFinite(mean)) {
      throw new Error(`groups[${index}].mean must be a finite number, got ${mean}`);
    }
    if (!Number.isFinite(ss) || ss < 0) {
      throw new Error(`groups[${index}].ss must be a finite number >= 0, got ${ss}`);
    }
    // One value has no spread about its own mean; anything else means the moments are corrupt.
    if (n === 1 && ss !== 0) {
      throw new Error(`groups[${index}].ss must be 0 for a group of one value, got ${ss}`);
    }
    kept.push(group);
  });
  return kept;
}
