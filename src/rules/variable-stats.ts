import type { Profile } from '../profile/types.js';
import { anovaIcc } from '../stats/anova-icc.js';
import { nonEmptyGroups } from '../stats/non-empty-groups.js';
import { meanReliability } from '../stats/reliability.js';
import { remlComponents } from '../stats/reml-components.js';
import { totalCount } from '../stats/sums.js';
import type { OutcomeStats } from '../stats/types.js';

/** What the predictor rules read of a variable's null model: REML, ANOVA and the group-mean reliability. */
export type VariableStats = Pick<OutcomeStats, 'n' | 'groups' | 'reml' | 'anova' | 'meanReliability'>;

const cache = new WeakMap<Profile, Map<string, VariableStats>>();

/**
 * The REML and ANOVA statistics of a numeric variable and the mean reliability of its group
 * means (the parts of outcomeStats that predictor-between-share and low-group-mean-reliability
 * read; ML is left out), computed once per profile and column however many rules ask.
 *
 * @param profile the one profiling pass
 * @param column a numeric-profiled column
 * @returns its statistics over the groups
 */
export function variableStats(profile: Profile, column: string): VariableStats {
  let byColumn = cache.get(profile);
  if (!byColumn) {
    byColumn = new Map();
    cache.set(profile, byColumn);
  }
  let stats = byColumn.get(column);
  if (!stats) {
    const groups = nonEmptyGroups(profile.moments(column));
    const reml = remlComponents(groups);
    stats = {
      n: totalCount(groups),
      groups: groups.length,
      reml,
      anova: anovaIcc(groups),
      meanReliability: meanReliability(groups, reml.tau2, reml.sigma2),
    };
    byColumn.set(column, stats);
  }
  return stats;
}
