import { key } from '../source/plan/profile-query.js';
import type { Profile } from '../profile/types.js';

/**
 * Per group, the lowest and highest value of a column as the profile holds them: numbers for
 * numeric-profiled columns that are not categorical, text otherwise. Equal ⇔ constant in the group.
 */
export function groupRange(profile: Profile, column: string): { lo: (number | string | null)[]; hi: (number | string | null)[]; numeric: boolean } {
  const col = profile.column(column);
  const numeric = col.numericProfiled && col.type !== 'categorical' && (col.storage === 'double' || col.numeric === col.nonMissing);
  const lo = profile.groups.array(key(column, numeric ? 'nmin' : 'min')) as (number | string | null)[];
  const hi = profile.groups.array(key(column, numeric ? 'nmax' : 'max')) as (number | string | null)[];
  return { lo, hi, numeric };
}
