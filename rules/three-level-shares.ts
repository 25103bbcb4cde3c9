import { defineRule } from '../src/rules/define.js';
import { percent } from '../src/rules/describe.js';
import type { FindingDraft } from '../src/rules/types.js';
import { formatNumber, pClause } from '../src/util/format.js';

interface Params {
  parent_share_at_least: number;
  overstated_above: number;
  alpha: number;
}

/** A declared parent level that holds variance the two-level model would give to the groups. */
export default defineRule<Params>({
  meta: {
    id: 'three-level-shares',
    title: 'Variance at the parent level',
    level: 'variance',
    defaultSeverity: 'warning',
    description:
      'With `parent` declared, the three-level null model (records within groups within parents) fitted by REML and ML, ' +
      'exact for unbalanced data, with each level’s share of the outcome variance in the report. It warns when the parent ' +
      'level holds a real share (above a threshold and a likelihood-ratio test of its variance below alpha), or when leaving ' +
      'the parent out would overstate the group-level variance, because a two-level model gives the parent’s variance to ' +
      'the groups. Groups under several parents, or none, are left out of the fit (group-in-several-parents names them).',
    params: {
      type: 'object',
      properties: {
        parent_share_at_least: {
          type: 'number',
          minimum: 0,
          maximum: 1,
          default: 0.05,
          description: 'parent share of the total variance counted as real (LeBreton & Senter 2008: an ICC of .05 is small to medium)',
        },
        overstated_above: {
          type: 'number',
          exclusiveMinimum: 0,
          default: 0.25,
          description: 'how much larger (relative) the two-level group variance may be than the three-level one (common practice)',
        },
        alpha: {
          type: 'number',
          exclusiveMinimum: 0,
          maximum: 1,
          default: 0.05,
          description: 'level of the likelihood-ratio test of the parent variance (common practice)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      parentShare: {
        message:
          '{column}: the {parent} level holds {share} of the variance (three-level REML: {parent} τ² {tauParent}, {group} τ² ' +
          '{tauGroup}, σ² {sigma2}; test of the {parent} variance {p}); a two-level model would put {tauTwoLevel} at the {group} ' +
          'level. {groups} groups under {parents} {parent} values, {excluded} left out',
        fix:
          'No change to the delivery; fit the three levels ({group} within {parent}), or {parent} as fixed effects when it has ' +
          'few values, as the analysis plan decides (guidance, not a verdict)',
      },
      groupOverstated: {
        message:
          '{column}: leaving {parent} out puts {tauTwoLevel} of variance at the {group} level (two-level REML) against {tauGroup} ' +
          'with {parent} in the model ({parent} share {share}, test {p}). {groups} groups under {parents} {parent} values, ' +
          '{excluded} left out',
        fix:
          'No change to the delivery; keep {parent} in the model (as a level or fixed effects) so that the {group}-level variance ' +
          'is not overstated, as the analysis plan decides (guidance, not a verdict)',
      },
    },
    sources: [
      'Searle, S. R., Casella, G., & McCulloch, C. E. (1992). Variance Components. Wiley, ch. 6: ML and REML of nested models',
      // checked against the ERIC record's abstract (ED 422 400); the later journal version is not cited, being unchecked
      'Opdenakker, M.-C., & Van Damme, J. (1998). The importance of identifying levels in multilevel analysis: an illustration of ' +
        'the effects of ignoring the top or intermediate levels in school effectiveness research. Paper presented at the annual ' +
        'meeting of the American Educational Research Association, San Diego (ERIC ED422400): ignoring the top level overstates ' +
        'the variance of the highest level kept, ignoring an intermediate level that of the levels just above and below it',
      'Self, S. G., & Liang, K.-Y. (1987). JASA, 82(398), 605–610; Stram, D. O., & Lee, J. W. (1994). Biometrics, 50(4), ' +
        '1171–1177: a variance tested on its boundary against ½χ²₀ + ½χ²₁',
      'LeBreton, J. M., & Senter, J. L. (2008). Organizational Research Methods, 11(4), 815–852: ICC(1) of .05 is small to medium',
    ],
  },
  check({ outcomes, roles, params }) {
    const parent = roles.parent;
    if (!parent) return [];
    const findings: FindingDraft[] = [];
    for (const [column, s] of Object.entries(outcomes)) {
      const t = s.threeLevel;
      if (!t || !(t.parentTest.p < params.alpha)) continue;
      const share = t.reml.shares.parent;
      const overstated = t.groupsOnly.tau2 > (1 + params.overstated_above) * t.reml.tau2Group;
      const big = share >= params.parent_share_at_least;
      if (!big && !overstated) continue;
      findings.push({
        messageId: big ? 'parentShare' : 'groupOverstated',
        column,
        data: {
          column,
          parent,
          group: roles.group,
          share: percent(share),
          tauParent: formatNumber(t.reml.tau2Parent, 4),
          tauGroup: formatNumber(t.reml.tau2Group, 4),
          sigma2: formatNumber(t.reml.sigma2, 4),
          tauTwoLevel: formatNumber(t.groupsOnly.tau2, 4),
          p: pClause(t.parentTest.p),
          groups: t.groups,
          parents: t.parents,
          excluded: t.excludedGroups,
        },
      });
    }
    return findings;
  },
});
