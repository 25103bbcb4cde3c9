import type { Profile } from '../profile/types.js';
import { outcomeStats } from '../stats/outcome-stats.js';
import type { OutcomeStats } from '../stats/types.js';

const cache = new WeakMap<Profile, Map<string, OutcomeStats>>();

/**
 * The null-model statistics of a numeric variable (REML, ML, ANOVA; see outcomeStats), computed
 * once per profile and column however many rules ask for them.
 *
 * @param profile the one profiling pass
 * @param column a numeric-profiled column
 * @returns its statistics over the groups
 */
export function variableStats(profile: Profile, column: string): OutcomeStats {
  let byColumn = cache.get(profile);
  if (!byColumn) {
    byColumn = new Map();
    cache.set(profile, byColumn);
  }
  let stats = byColumn.get(column);
  if (!stats) {
    stats = outcomeStats(profile.moments(column));
    byColumn.set(column, stats);
  }
  return stats;
}
