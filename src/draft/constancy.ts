import { groupSizes } from '../profile/group-stats.js';
import type { Profile } from '../profile/types.js';
import { groupRange } from '../rules/within.js';

/** Within how many groups a column keeps one value: only groups of two records or more with a value can tell. */
export interface Constancy {
  constant: number;
  groups: number;
}

/**
 * "Almost every group": a level-2 variable with a few slips (a value mistyped in two groups of
 * sixty) is still a level-2 variable, whose slips the audit then reports (heuristic).
 */
export const LEVEL2_SHARE = 0.95;

export function constancy(profile: Profile, column: string): Constancy {
  const { lo, hi } = groupRange(profile, column);
  const sizes = groupSizes(profile.groups);
  let constant = 0;
  let groups = 0;
  for (let i = 0; i < sizes.length; i++) {
    if (sizes[i] < 2 || lo[i] === null) continue;
    groups++;
    if (lo[i] === hi[i]) constant++;
  }
  return { constant, groups };
}

/** Constant within (almost) every group that can tell. */
export function isConstant(k: Constancy): boolean {
  return k.groups > 0 && k.constant >= LEVEL2_SHARE * k.groups;
}
