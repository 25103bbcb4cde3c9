import { groupIds, groupStat } from '../profile/group-stats.js';
import type { Profile } from '../profile/types.js';
import type { OutcomeStats } from '../stats/types.js';
import { cappedIndices } from './capped-indices.js';
import type { GroupMean, GroupMeans } from './types.js';

/** At most this many group means go into a report (the JSON must stay small for 1M groups). */
export const MAX_GROUP_MEANS = 2000;
/** Of those, this many of the lowest and of the highest means are always kept. */
export const GROUP_MEAN_ENDS = 100;

/**
 * Group means of one numeric column, sorted by mean (ties by group ID), each with the standard
 * error sqrt(σ²/n_j) from the REML within-group variance, so mean ± 1.96·se is its 95% interval
 * under the null model. Groups without a value are left out. Beyond MAX_GROUP_MEANS groups the
 * GROUP_MEAN_ENDS lowest and highest and an even sample of the rest are kept; `rank` is the
 * position among all groups, so the plot keeps the shape of the whole spread.
 */
export function groupMeans(profile: Profile, column: string, stats: OutcomeStats): GroupMeans {
  const ids = groupIds(profile.groups);
  const num = groupStat(profile.groups, column, 'numericCount');
  const mean = groupStat(profile.groups, column, 'mean');
  const sigma2 = stats.reml.sigma2;
  const all: Omit<GroupMean, 'rank'>[] = [];
  for (let i = 0; i < ids.length; i++) {
    const n = num[i];
    if (!(n > 0) || mean[i] === null) continue;
    all.push({ group: ids[i], n, mean: mean[i] as number, se: Math.sqrt(sigma2 / n) });
  }
  all.sort((a, b) => a.mean - b.mean || (a.group < b.group ? -1 : a.group > b.group ? 1 : 0));
  const points = cappedIndices(all.length, MAX_GROUP_MEANS, GROUP_MEAN_ENDS).map((i) => ({ ...all[i], rank: i + 1 }));
  return { total: all.length, sigma2, mean: stats.reml.mean, points };
}
