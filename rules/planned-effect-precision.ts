import { defineRule } from '../src/rules/define.js';
import type { FindingDraft } from '../src/rules/types.js';
import { formatNumber } from '../src/util/format.js';

interface Params {
  alpha: number;
  power: number;
}

/** How small an effect of the planned level-2 predictor the delivery can detect, or the power for the one the study needs. */
export default defineRule<Params>({
  meta: {
    id: 'planned-effect-precision',
    title: 'Precision for the planned level-2 effect',
    level: 'variance',
    defaultSeverity: 'note',
    description:
      'With `detect` in the role map: the minimum detectable effect size (MDES, in outcome standard deviations) of the planned ' +
      'level-2 predictor from the observed ICC, the number of groups and their sizes (Bloom 2005; Raudenbush 1997), allowing ' +
      'for unequal sizes (Eldridge et al. 2006); with an effect size given, the power to detect it. A planning figure from the ' +
      'null model, no covariates: guidance for the study’s analysis plan, not a verdict on the delivery.',
    params: {
      type: 'object',
      properties: {
        alpha: {
          type: 'number',
          exclusiveMinimum: 0,
          exclusiveMaximum: 1,
          default: 0.05,
          description: 'two-sided type I error rate of the planned test (common practice; Bloom 2005 uses .05)',
        },
        power: {
          type: 'number',
          exclusiveMinimum: 0,
          exclusiveMaximum: 1,
          default: 0.8,
          description: 'the power the MDES is defined for, and below which a given effect is called underpowered (Bloom 2005: .80)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      mdes: {
        message:
          '{column}: with {groups} groups (mean {size} records, size CV {cv}) and ICC {icc}, the smallest effect of {predictor} ' +
          'detectable with power {power} at α {alpha} is {mdes} SD ({equal} SD with equal sizes); a planning figure, not a verdict',
        fix: 'No change to the delivery; compare the MDES with the effect the study’s analysis plan must detect',
      },
      underpowered: {
        message:
          '{column}: power {achieved} to detect an effect of {effect} SD of {predictor} with {groups} groups (ICC {icc}); the ' +
          'smallest effect detectable with power {power} is {mdes} SD (guidance, the analysis plan decides)',
        fix:
          'Ask whether more groups can be delivered: more groups raise the power far more than more records per group when the ICC ' +
          'is not small',
      },
      notComputed: {
        message: '{column}: no precision for {predictor}: {reason}',
        fix: 'Check that the predictor to detect is a level-2 variable with numbers and at least two values across groups',
      },
    },
    sources: [
      'Bloom, H. S. (2005). Randomizing groups to evaluate place-based programs. In Learning More from Social Experiments ' +
        '(pp. 115–172). Russell Sage Foundation: MDES = M·sqrt(ρ/(P(1−P)J) + (1−ρ)/(P(1−P)Jn)), M = t(1−α/2) + t(power)',
      'Raudenbush, S. W. (1997). Statistical analysis and optimal design for cluster randomized trials. Psychological Methods, ' +
        '2(2), 173–185',
      'Eldridge, S. M., Ashby, D., & Kerry, S. (2006). International Journal of Epidemiology, 35(5), 1292–1300: design effect ' +
        '1 + ((CV² + 1)n̄ − 1)ρ for unequal cluster sizes',
    ],
  },
  check({ outcomes, roles }) {
    const detect = roles.detect;
    if (!detect) return [];
    const out: FindingDraft[] = [];
    for (const [column, s] of Object.entries(outcomes)) {
      const p = s.precision;
      if (!p) {
        out.push({ messageId: 'notComputed', column, data: { column, predictor: detect.predictor, reason: NOT_COMPUTED } });
        continue;
      }
      const shared = {
        column,
        predictor: p.predictor,
        groups: p.groups,
        icc: formatNumber(p.icc, 3),
        power: formatNumber(p.targetPower, 2),
        mdes: formatNumber(p.mdes, 3),
      };
      if (p.effectSize !== undefined && p.power !== undefined) {
        if (p.power >= p.targetPower) continue;
        const data = { ...shared, effect: p.effectSize, achieved: formatNumber(p.power, 2) };
        out.push({ messageId: 'underpowered', severity: 'warning', column, data });
        continue;
      }
      const data = {
        ...shared,
        size: formatNumber(p.meanSize, 1),
        cv: formatNumber(p.sizeCv, 2),
        alpha: p.alpha,
        equal: formatNumber(p.mdesEqual, 3),
      };
      out.push({ messageId: 'mdes', column, data });
    }
    return out;
  },
});

const NOT_COMPUTED = 'it does not read as numbers, takes one value, or fewer than three groups hold it with the outcome';
