import { groupIds, groupStat } from '../profile/group-stats.js';
import type { Profile } from '../profile/types.js';
import type { Roles } from '../roles/types.js';
import type { Lookup, ParentSubset } from '../source/lookups/lookup.js';

/** A group ID found under more than one parent, with what its parent subsets say. */
export interface ParentSplit {
  group: string;
  subsets: ParentSubset[];
  /** a level-2 variable that is constant within each parent subset but differs between them */
  differs?: { column: string; values: string[] };
}

/**
 * Group IDs under more than one parent, read from the profile (parent min ≠ max within the
 * group), and the first `examine` of them split by parent through one bounded look-up. The
 * heuristic that tells "one group split across parents" from "one code reused by different
 * parents": a level-2 variable whose value is constant within each parent subset but differs
 * between the subsets says the subsets are different groups.
 */
export async function parentSplits(
  profile: Profile,
  roles: Roles,
  lookup: Lookup,
  examine: number,
): Promise<{ total: number; examined: ParentSplit[] }> {
  const parent = roles.parent;
  if (!parent) return { total: 0, examined: [] };
  const ids = groupIds(profile.groups);
  const lo = groupStat(profile.groups, parent, 'textMin');
  const hi = groupStat(profile.groups, parent, 'textMax');
  const flagged = ids.filter((_, i) => lo[i] !== null && lo[i] !== hi[i]);
  if (flagged.length === 0) return { total: 0, examined: [] };
  const level2 = roles.level2.filter((c) => profile.header.includes(c));
  const subsets = await lookup.parentSubsets(parent, flagged.slice(0, examine), level2);
  const byGroup = new Map<string, ParentSubset[]>();
  for (const s of subsets) byGroup.set(s.group, [...(byGroup.get(s.group) ?? []), s]);
  const examined = flagged.slice(0, examine).map((group): ParentSplit => {
    const parts = byGroup.get(group) ?? [];
    for (let c = 0; c < level2.length; c++) {
      const values = parts.map((p) => p.constant[c]);
      if (values.every((v) => v !== null) && new Set(values).size > 1) {
        return { group, subsets: parts, differs: { column: level2[c], values: values as string[] } };
      }
    }
    return { group, subsets: parts };
  });
  return { total: flagged.length, examined };
}

/** `G1: amber (40) / birch (2)` */
export function describeSplit(split: ParentSplit): string {
  return `${split.group}: ${split.subsets.map((s) => `${s.parent} (${s.count})`).join(' / ')}`;
}
