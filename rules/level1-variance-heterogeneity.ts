import { defineRule } from '../src/rules/define.js';
import { linearOutcomes } from '../src/rules/linear-outcomes.js';
import type { FindingDraft } from '../src/rules/types.js';
import { varianceHomogeneityH } from '../src/stats/variance-homogeneity-h.js';
import { formatNumber, pClause } from '../src/util/format.js';

interface Params {
  min_records: number;
  alpha: number;
}

/** The usual model assumes one level-1 variance in every group; the H test checks that before the fit. */
export default defineRule<Params>({
  meta: {
    id: 'level1-variance-heterogeneity',
    title: 'Level-1 variance differs between groups',
    level: 'variance',
    defaultSeverity: 'note',
    description:
      'For each outcome that is not binary: the H test of equal within-group (level-1) variances across groups, from the null ' +
      "model's residuals (each group's variance about its own mean), over the groups with enough records (Raudenbush & Bryk " +
      '2002, ch. 9). Unequal variances bias the standard errors of a model that assumes one level-1 variance, and often point ' +
      'to a skewed outcome or to groups that measure differently. Like every test of variances it is sensitive to non-normal ' +
      'outcomes, and with many records it flags small differences: guidance, not law.',
    params: {
      type: 'object',
      properties: {
        min_records: {
          type: 'integer',
          minimum: 2,
          default: 10,
          description:
            'groups with fewer records are left out of the test (common practice: the normal approximation of a log variance ' +
            'needs moderate group sizes)',
        },
        alpha: {
          type: 'number',
          exclusiveMinimum: 0,
          maximum: 1,
          default: 0.05,
          description: 'a note when the test rejects equal variances at this level (common practice: the conventional 5%)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      unequal: {
        message:
          '{column}: within-group variances differ across groups (H = {h} on {df} df, {p}); from {min} to {max} in the {groups} ' +
          'groups with at least {minRecords} records',
        fix:
          'No change to the delivery unless a group measured differently; guidance: check the groups with the smallest and ' +
          'largest spread, consider a transformation of a skewed outcome, or a model whose level-1 variance depends on group ' +
          'variables; the analysis plan decides',
      },
    },
    sources: [
      'Raudenbush, S. W., & Bryk, A. S. (2002). Hierarchical Linear Models (2nd ed.), ch. 9 (test of homogeneity of level-1 variance)',
      'min_records 10, alpha 0.05: common practice',
    ],
  },
  check({ profile, roles, params, outcomes }) {
    const findings: FindingDraft[] = [];
    for (const column of linearOutcomes(profile, roles, outcomes)) {
      const h = varianceHomogeneityH(profile.moments(column), params.min_records);
      if (!(h.p < params.alpha)) continue;
      findings.push({
        messageId: 'unequal',
        column,
        count: h.groups,
        data: {
          column,
          h: formatNumber(h.statistic, 2),
          df: h.df,
          p: pClause(h.p),
          min: formatNumber(h.minVariance, 3),
          max: formatNumber(h.maxVariance, 3),
          groups: h.groups,
          minRecords: params.min_records,
        },
      });
    }
    return findings;
  },
});
