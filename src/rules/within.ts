import { groupStat } from '../profile/group-stats.js';
import { readsAsNumbers } from '../profile/reads-as-numbers.js';
import type { Profile } from '../profile/types.js';

/**
 * Per group, the lowest and highest value of a column as the profile holds them: numbers for
 * columns that read as numbers and hold nothing else (the number range would miss a stray token),
 * text otherwise. Equal ⇔ constant in the group.
 */
export function groupRange(
  profile: Profile,
  column: string,
): { lo: (number | string | null)[]; hi: (number | string | null)[]; asNumbers: boolean } {
  const col = profile.column(column);
  const asNumbers = readsAsNumbers(col) && (col.storage === 'double' || col.numericCount === col.nonMissing);
  const lo = asNumbers ? groupStat(profile.groups, column, 'numMin') : groupStat(profile.groups, column, 'textMin');
  const hi = asNumbers ? groupStat(profile.groups, column, 'numMax') : groupStat(profile.groups, column, 'textMax');
  return { lo, hi, asNumbers };
}
