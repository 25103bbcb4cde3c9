import { groupIds } from '../src/profile/group-stats.js';
import { hasPair, pairMoments } from '../src/profile/pairs.js';
import { readsAsNumbers } from '../src/profile/reads-as-numbers.js';
import { defineRule } from '../src/rules/define.js';
import type { FindingDraft } from '../src/rules/types.js';
import type { PairMoments } from '../src/stats/pair-moments.js';
import { slopeMomentEstimate } from '../src/stats/slope-moment-estimate.js';
import { formatNumber } from '../src/util/format.js';

interface Params {
  min_records: number;
  min_groups: number;
  min_reliability: number;
}

const LISTED = 20;

/** A random slope needs groups that vary in the variable, and slopes that differ more than their noise. */
export default defineRule<Params>({
  meta: {
    id: 'slope-support',
    title: 'Support for each planned random slope',
    level: 'variance',
    defaultSeverity: 'warning',
    description:
      'For each planned random slope (role map `slopes`) and outcome: the groups that can inform the slope (at least two distinct ' +
      'values of the variable and enough records), the records against groups × random coefficients (a fitting library refuses ' +
      'a model with no more records than random effects), and, for outcomes that are not binary, the moment estimate of the ' +
      "slope's variance from the per-group OLS slopes (their variance minus their mean sampling variance, with the pooled " +
      "within-group residual variance) and the slopes' reliability. A non-positive estimate or a very low reliability predicts " +
      'a singular fit: advise a fixed slope. Without `slopes` in the role map the rule does nothing.',
    params: {
      type: 'object',
      properties: {
        min_records: {
          type: 'integer',
          minimum: 3,
          default: 5,
          description: 'a group informs a slope from this many records with the variable (common practice; 3 is the least for a residual)',
        },
        min_groups: {
          type: 'integer',
          minimum: 2,
          default: 10,
          description: 'a warning below this many informing groups (common practice: a variance needs groups, as for τ² itself)',
        },
        min_reliability: {
          type: 'number',
          minimum: 0,
          maximum: 1,
          default: 0.1,
          description:
            'a warning below this mean reliability of the OLS slopes (common practice; Raudenbush & Bryk 2002, ch. 3, on low ' +
            'reliabilities and estimation problems)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      tooFewRecords: {
        message:
          '{column}: {records} records for {groups} groups × {coefficients} random coefficients = {effects} random effects: a fitting ' +
          'library refuses a model with no more records than random effects',
        fix: 'Ask whether more records per group can be delivered, or plan fewer random slopes',
      },
      noSupport: {
        message:
          '{column} on {outcome}: only {informing} of {groups} groups have two or more distinct values of {column} and at least ' +
          '{minRecords} records, so no group variance of its slope can be estimated',
        fix:
          'Ask whether {column} should vary within groups (a level-1 variable constant in every group is a level-2 one); ' +
          'otherwise plan {column} as a fixed slope',
      },
      fewGroups: {
        message:
          '{column} on {outcome}: {informing} of {groups} groups can inform the random slope (two or more distinct values and at ' +
          'least {minRecords} records), below {minGroups}',
        fix: 'No change to the delivery; guidance: a random slope on so few groups is poorly estimated, a fixed slope is safer',
      },
      noVariance: {
        message:
          '{column} on {outcome}: the per-group slopes vary no more than their sampling error (variance {observed}, mean sampling ' +
          'variance {sampling}, moment estimate {tau11} from {informing} groups): a random slope will likely be a singular fit',
        fix: 'No change to the delivery; guidance: plan {column} as a fixed slope unless the analysis plan needs it random',
      },
      lowReliability: {
        message:
          '{column} on {outcome}: slope variance {tau11} (moment estimate from {informing} groups) but the per-group slopes have a ' +
          'mean reliability of {reliability}, below {minReliability}: the random slope may come out singular',
        fix: 'No change to the delivery; guidance: consider a fixed slope, or more records per group with spread in {column}',
      },
    },
    sources: [
      'Swamy, P. A. V. B. (1970). Efficient inference in a random coefficient regression model. Econometrica, 38(2), 311–323',
      'Raudenbush, S. W., & Bryk, A. S. (2002). Hierarchical Linear Models (2nd ed.), ch. 3 (OLS slopes per group, their ' +
        'reliability, the variance of the slopes)',
      'Bates, D., Mächler, M., Bolker, B., & Walker, S. (2015). Fitting linear mixed-effects models using lme4. Journal of ' +
        'Statistical Software, 67(1) (singular fits; the check that records exceed random effects)',
      'min_records 5, min_groups 10, min_reliability 0.1: common practice',
    ],
  },
  check({ profile, roles, params }) {
    const slopes = roles.slopes ?? [];
    if (!slopes.length) return [];
    const ids = groupIds(profile.groups);
    return roles.outcomes
      .filter((outcome) => readsAsNumbers(profile.column(outcome)))
      .flatMap((outcome) =>
        slopes
          .filter((column) => hasPair(profile, outcome, column))
          .flatMap((column) => {
            const linear = profile.column(outcome).type !== 'binary';
            const found = checkSlope(pairMoments(profile, outcome, column), { outcome, column, linear, ids }, slopes.length, params);
            return found ? [found] : [];
          }),
      );
  },
});

/** The one finding (or none) for a planned slope of one outcome, most serious first. */
function checkSlope(
  pairs: readonly PairMoments[],
  at: { outcome: string; column: string; linear: boolean; ids: readonly string[] },
  slopeCount: number,
  params: Params,
): FindingDraft | null {
  const { outcome, column } = at;
  const groups = pairs.length;
  const coefficients = 1 + slopeCount;
  const records = pairs.reduce((a, g) => a + g.n, 0);
  const effects = groups * coefficients;
  if (records <= effects) {
    return { messageId: 'tooFewRecords', severity: 'blocker', column, data: { column, outcome, records, groups, coefficients, effects } };
  }
  const informs = pairs.filter((g) => g.sxx > 0 && g.n >= params.min_records);
  const lacking = pairs.filter((g) => !(g.sxx > 0 && g.n >= params.min_records));
  const base = { column, outcome, informing: informs.length, groups, minRecords: params.min_records };
  const listed = { count: lacking.length, groups: lacking.slice(0, LISTED).map((g) => at.ids[g.index ?? 0]) };
  if (informs.length < 2) return { messageId: 'noSupport', severity: 'blocker', column, data: base, ...listed };
  if (informs.length < params.min_groups) {
    return { messageId: 'fewGroups', column, data: { ...base, minGroups: params.min_groups }, ...listed };
  }
  if (!at.linear) return null;
  const s = slopeMomentEstimate(pairs);
  if (!Number.isFinite(s.tau11)) return null;
  const numbers = { ...base, tau11: formatNumber(s.tau11, 4), informing: s.groups };
  if (s.tau11 <= 0) {
    const spread = { observed: formatNumber(s.observedVariance, 4), sampling: formatNumber(s.meanSamplingVariance, 4) };
    return { messageId: 'noVariance', column, data: { ...numbers, ...spread } };
  }
  if (s.reliability < params.min_reliability) {
    const r = { reliability: formatNumber(s.reliability, 3), minReliability: params.min_reliability };
    return { messageId: 'lowReliability', column, data: { ...numbers, ...r } };
  }
  return null;
}
