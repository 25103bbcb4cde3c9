import type { ParentBlocks } from '../stats/three-level-terms.js';
import { groupStat } from './group-stats.js';
import type { Profile } from './types.js';

/** An outcome's groups by parent, and the groups that could not be placed under one parent. */
export interface ParentedMoments {
  blocks: ParentBlocks;
  /** groups with outcome values under more than one parent (group-in-several-parents) or none */
  excluded: number;
}

/**
 * An outcome's per-group moments taken together by parent, read from the one profiling pass:
 * a group's parent is its parent column's value when that is constant in the group (min = max).
 * Groups under several parents are left out rather than guessed: the group-in-several-parents
 * rule names them, and the fit holds for the groups that nest cleanly. Groups without a value
 * of the outcome are not groups of the fit.
 *
 * @param profile the profile
 * @param parent the parent column
 * @param outcome a numeric-profiled outcome
 */
export function parentedMoments(profile: Profile, parent: string, outcome: string): ParentedMoments {
  const lo = groupStat(profile.groups, parent, 'textMin');
  const hi = groupStat(profile.groups, parent, 'textMax');
  const n = groupStat(profile.groups, outcome, 'numericCount');
  const mean = groupStat(profile.groups, outcome, 'mean');
  const ss = groupStat(profile.groups, outcome, 'ss');
  const byParent = new Map<string, number[]>();
  let excluded = 0;
  for (let j = 0; j < n.length; j++) {
    if (!(n[j] > 0)) continue;
    const p = lo[j];
    if (p === null || p !== hi[j]) {
      excluded++;
      continue;
    }
    const list = byParent.get(p);
    if (list) list.push(j);
    else byParent.set(p, [j]);
  }
  const order = [...byParent.values()].flat();
  const start = [0];
  for (const list of byParent.values()) start.push(start[start.length - 1] + list.length);
  return {
    blocks: {
      n: Float64Array.from(order, (j) => n[j]),
      mean: Float64Array.from(order, (j) => mean[j] as number),
      ss: Float64Array.from(order, (j) => Math.max(0, ss[j] as number)),
      start: Int32Array.from(start),
    },
    excluded,
  };
}
