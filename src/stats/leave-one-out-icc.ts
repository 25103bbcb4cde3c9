import { remlComponents } from './reml-components.js';
import type { SizeClass } from './size-classes.js';
import { bySize, multiplicity, spreadOf } from './size-classes.js';
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

/**
 * leaveOneOutIcc for several groups at once, each the same exact refit. Many groups are taken
 * together by size once (src/stats/size-classes.ts), and each refit takes the one group out of its
 * class by Welford's update run backwards (Welford 1962, Technometrics 4(3), 419–420) instead of
 * classing the J − 1 others again.
 *
 * @param groups per-group moments (n ≥ 1)
 * @param indices the groups to leave out, one refit each
 * @returns the ICC without each, in the order of `indices`
 */
export function leaveOneOutIccs(groups: readonly GroupMoments[], indices: readonly number[]): number[] {
  const classes = bySize(groups);
  if (classes === groups) return indices.map((j) => leaveOneOutIcc(groups, j));
  return indices.map((j) => {
    const g = groups[j];
    const at = classes.findIndex((c) => c.n === g.n);
    const without = withoutOne(classes[at], g);
    const rest = classes.slice();
    if (without) rest[at] = without;
    else rest.splice(at, 1);
    return remlComponents(rest).icc;
  });
}

/** A size class less one of its groups (null when it was the only one). */
function withoutOne(c: GroupMoments, g: GroupMoments): SizeClass | null {
  const count = multiplicity(c) - 1;
  if (count === 0) return null;
  const mean = (multiplicity(c) * c.mean - g.mean) / count;
  const spread = Math.max(0, spreadOf(c) - (g.mean - c.mean) * (g.mean - mean));
  return { n: c.n, mean, ss: Math.max(0, c.ss - g.ss), count, spread };
}
