import { groupSizes } from '../profile/group-stats.js';
import { readsAsNumbers } from '../profile/reads-as-numbers.js';
import type { Profile } from '../profile/types.js';
import type { Roles } from '../roles/types.js';
import { variableStats } from '../rules/variable-stats.js';
import type { OutcomeStats } from '../stats/types.js';
import { groupMeans } from './group-means.js';
import type { PlotThresholds } from './plot-thresholds.js';
import { sizeHistogram } from './size-histogram.js';
import type { PlotData } from './types.js';

/**
 * What the HTML plots need, built once from the profile before any renderer runs, so that
 * renderers never read data or fit a model: a histogram of group sizes, per outcome the sorted
 * group means with standard errors (capped, see groupMeans), per numeric level-1 column its
 * between-group share (REML ICC and ANOVA ICC(1), the centering advice), and the thresholds
 * to mark.
 *
 * @param profile the one profiling pass
 * @param roles the normalised role map
 * @param outcomes the statistics of each numeric outcome, as the report carries them
 * @param thresholds the thresholds the rules ran with (see plotThresholds)
 */
export function buildPlotData(
  profile: Profile,
  roles: Roles,
  outcomes: Record<string, OutcomeStats>,
  thresholds: PlotThresholds,
): PlotData {
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
  if (thresholds.smallGroups !== undefined) data.smallGroupThreshold = thresholds.smallGroups;
  if (thresholds.lowIcc !== undefined) data.lowIccThreshold = thresholds.lowIcc;
  return data;
}
