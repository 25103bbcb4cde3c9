import { weightFactors, weightsAudit } from '../src/analysis/weights.js';
import { defineRule } from '../src/rules/define.js';
import type { FindingDraft } from '../src/rules/types.js';
import { formatNumber } from '../src/util/format.js';

interface Params {
  design_effect_above: number;
  effective_share_below: number;
}

/** Sampling weights checked before a weighted multilevel fit: their form, their values and what they cost. */
export default defineRule<Params>({
  meta: {
    id: 'weights-audit',
    title: 'Sampling weights',
    level: 'data',
    defaultSeverity: 'warning',
    description:
      'With weights declared: a level-2 weight must be one value within its group; weights must be positive and present; ' +
      'Kish’s design effect of weighting and effective sizes say what the weights cost in precision; level-1 weights that look ' +
      'total rather than conditional on the group are flagged (a heuristic). How the scale factors of the two usual scalings of ' +
      'level-1 weights within groups spread, and the groups with the most extreme ones, are in the report’s `weights`; every ' +
      'group’s factors come with `--weight-factors`. Guidance: the study’s analysis plan decides how weights enter.',
    params: {
      type: 'object',
      properties: {
        design_effect_above: {
          type: 'number',
          minimum: 1,
          default: 1.5,
          description: 'note when Kish’s weighting design effect 1 + CV² exceeds this (common practice)',
        },
        effective_share_below: {
          type: 'number',
          minimum: 0,
          maximum: 1,
          default: 0.5,
          description:
            'note groups whose Kish effective size of level-1 weights is below this share of their records: a few weights carry ' +
            'the group (common practice)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      level2Varies: {
        message: '{column}: the level-2 weight is not one value within {count} of {groups} groups',
        fix: 'Ask the sender for one weight per group (a group weight that varies within a group is a level-1 weight, or a join error)',
      },
      nonPositive: {
        message: '{column}: weights of zero or below in {count} groups (smallest: {values}); a weighted fit cannot use them',
        fix: 'Ask the sender whether these records belong in the sample; a design weight is positive',
      },
      missing: {
        message: '{column}: {count} records without a weight',
        fix: 'Ask the sender for the missing weights, or whether these records are outside the weighted sample',
      },
      level2Missing: {
        message: '{column}: {count} of {groups} groups without a level-2 weight',
        fix: 'Ask the sender for the missing group weights',
      },
      designEffect: {
        message:
          '{column}: unequal weighting alone inflates the variance of a mean by {deff} (Kish 1 + CV²), an effective {effective} of ' +
          '{n} {unit}; guidance, not a defect',
        fix:
          'No change to the delivery; expect wider intervals than the raw counts suggest, and check the weights’ trimming with ' +
          'the sender',
      },
      smallEffective: {
        message: '{column}: in {count} groups the Kish effective size of the level-1 weights is below {limit} of their records',
        fix:
          'No change to the delivery; scaled weights in these groups rest on few effective records (Carle 2009 advises comparing ' +
          'both scalings, see the report’s weights section)',
      },
      looksTotal: {
        message:
          '{column}: the level-1 weights look total, not conditional on the group: their group means follow {level2} across groups ' +
          '(log correlation {correlation}) and no record weight is below its group’s in {share} of groups (a heuristic)',
        fix:
          'Ask the sender whether the level-1 weights include the group’s selection; a multilevel fit needs conditional weights ' +
          '(level-1 weight over level-2 weight, Pfeffermann et al. 1998)',
      },
    },
    sources: [
      'Kish, L. (1965). Survey Sampling. Wiley, §11.7: effective size (Σw)²/Σw² and the design effect of weighting 1 + CV²',
      'Pfeffermann, D., Skinner, C. J., Holmes, D. J., Goldstein, H., & Rasbash, J. (1998). Journal of the Royal Statistical ' +
        'Society B, 60(1), 23–40: conditional level-1 weights and their scaling within groups',
      'Carle, A. C. (2009). Fitting multilevel models in complex survey data with design weights: recommendations. BMC Medical ' +
        'Research Methodology, 9, 49: scale to the group size and to the effective group size, compare both',
    ],
  },
  check({ profile, roles, params }) {
    const audit = weightsAudit(profile, roles);
    if (!audit) return [];
    const out: FindingDraft[] = [];
    const groupCount = profile.groups.numRows();
    const { level1: w1, level2: w2, form } = audit;
    if (w2?.varyingGroups.length) {
      const count = w2.varyingGroups.length;
      out.push({
        messageId: 'level2Varies',
        column: w2.column,
        count,
        groups: w2.varyingGroups,
        data: { column: w2.column, count, groups: groupCount },
      });
    }
    for (const w of [w1, w2]) {
      if (!w?.nonPositiveGroups.length) continue;
      const count = w.nonPositiveGroups.length;
      out.push({
        messageId: 'nonPositive',
        column: w.column,
        count,
        groups: w.nonPositiveGroups,
        data: { column: w.column, count },
        values: [String(w.min)],
      });
    }
    if (w1?.missing)
      out.push({ messageId: 'missing', column: w1.column, count: w1.missing, data: { column: w1.column, count: w1.missing } });
    if (w2?.missing) {
      out.push({
        messageId: 'level2Missing',
        column: w2.column,
        count: w2.missing,
        data: { column: w2.column, count: w2.missing, groups: groupCount },
      });
    }
    const costly = [
      w1 && { column: w1.column, deff: w1.designEffect, effective: w1.effectiveN, n: w1.records, unit: 'records' },
      w2 && { column: w2.column, deff: w2.designEffect, effective: w2.effectiveGroups, n: w2.groups, unit: 'groups' },
    ];
    for (const c of costly) {
      if (!c || !(c.deff > params.design_effect_above)) continue;
      out.push({
        messageId: 'designEffect',
        severity: 'note',
        column: c.column,
        data: { column: c.column, deff: formatNumber(c.deff, 2), effective: formatNumber(c.effective, 1), n: c.n, unit: c.unit },
      });
    }
    const small = w1 ? weightFactors(profile, w1.column).filter((g) => g.effectiveSize < params.effective_share_below * g.n) : [];
    if (w1 && small.length) {
      out.push({
        messageId: 'smallEffective',
        severity: 'note',
        column: w1.column,
        count: small.length,
        groups: small.map((g) => g.group),
        data: { column: w1.column, count: small.length, limit: `${formatNumber(100 * params.effective_share_below, 0)}%` },
      });
    }
    if (w1 && w2 && form?.form === 'total') {
      out.push({
        messageId: 'looksTotal',
        column: w1.column,
        data: {
          column: w1.column,
          level2: w2.column,
          correlation: formatNumber(form.correlation, 2),
          share: `${formatNumber(100 * form.atLeastGroupWeight, 0)}%`,
        },
      });
    }
    return out;
  },
});
