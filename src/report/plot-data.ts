import { catalogue } from '../../rules/index.js';
import type { Profile } from '../profile/types.js';
import { groupSizes } from '../profile/group-stats.js';
import { readsAsNumbers } from '../profile/reads-as-numbers.js';
import type { Roles } from '../roles/types.js';
import { resolveParams } from '../rules/engine.js';
import { variableStats } from '../rules/variable-stats.js';
import type { OutcomeStats } from '../stats/types.js';
import { groupMeans } from './plots/group-means.js';
import { sizeHistogram } from './plots/size-histogram.js';
import type { PlotData } from './types.js';

/**
 * Groups with fewer records than this are marked small on the size plot when the catalogue has
 * no small-groups rule to take it from: Clarke (2008) found valid estimates with an average of
 * five records per group and biased ones at two.
 */
export const SMALL_GROUP_THRESHOLD = 5;

/**
 * What the HTML plots need, built once from the profile so that renderers never read data:
 * a histogram of group sizes, per outcome the sorted group means with standard errors (capped,
 * see groupMeans), per numeric level-1 column its between-group share (REML ICC and ANOVA
 * ICC(1), the centering advice), and the thresholds to mark.
 *
 * @param profile the one profiling pass
 * @param roles the normalised role map (the low-icc threshold is read from its rule settings)
 * @param outcomes the statistics of each numeric outcome, as the report carries them
 */
export function buildPlotData(profile: Profile, roles: Roles, outcomes: Record<string, OutcomeStats>): PlotData {
  const groupMeansByOutcome: PlotData['groupMeans'] = {};
  for (const [name, stats] of Object.entries(outcomes)) groupMeansByOutcome[name] = groupMeans(profile, name, stats);

  const predictorShares: PlotData['predictorShares'] = {};
  for (const name of roles.level1) {
    const col = profile.column(name);
    if (!readsAsNumbers(col)) continue;
    // the same cached fit the predictor rules read: one REML fit per predictor per audit
    const s = variableStats(profile, name);
    predictorShares[name] = { reml: s.reml.icc, anova: s.anova.icc };
  }

  const data: PlotData = {
    groupSizes: sizeHistogram(groupSizes(profile.groups)),
    groupMeans: groupMeansByOutcome,
    predictorShares,
  };
  const small = ruleParam(roles, 'small-groups', 'size_below', SMALL_GROUP_THRESHOLD);
  if (small !== undefined) data.smallGroupThreshold = small;
  const lowIcc = ruleParam(roles, 'low-icc', 'icc_below', undefined);
  if (lowIcc !== undefined) data.lowIccThreshold = lowIcc;
  return data;
}

/**
 * A numeric param of a catalogue rule with the role map's settings (defaults filled in);
 * undefined when the rule is off, `fallback` when the catalogue has no such rule.
 */
function ruleParam(roles: Roles, id: string, param: string, fallback: number | undefined): number | undefined {
  const rule = catalogue.find((r) => r.meta.id === id);
  if (!rule) return fallback;
  const params = resolveParams(rule, roles);
  if (params === 'off') return undefined;
  return typeof params[param] === 'number' ? (params[param] as number) : fallback;
}
