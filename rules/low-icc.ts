import { defineRule } from '../src/rules/define.js';
import { formatNumber, pClause } from '../src/util/format.js';

interface Params {
  icc_below: number;
  alpha: number;
}

/** Little between-group variance: a random intercept may not be needed, but small is not nothing. */
export default defineRule<Params>({
  meta: {
    id: 'low-icc',
    title: 'Outcome ICC near zero',
    level: 'variance',
    defaultSeverity: 'warning',
    description:
      'The share of outcome variance between groups (REML ICC of the null model) is below a threshold ' +
      'and the ANOVA F-test finds no group differences. A single-level model may then do, but even a ' +
      'small ICC inflates type I error when groups are large, so this is advice to weigh, not a verdict.',
    params: {
      type: 'object',
      properties: {
        icc_below: {
          type: 'number',
          minimum: 0,
          maximum: 1,
          default: 0.05,
          description: 'ICC below which clustering counts as small (LeBreton & Senter 2008: .05 is small to medium)',
        },
        alpha: {
          type: 'number',
          exclusiveMinimum: 0,
          maximum: 1,
          default: 0.05,
          description: 'level of the F-test of equal group means (common practice)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      none: {
        message: '{column}: ICC {icc} (REML), F = {f} on ({df1}, {df2}) df, {p}: no evidence of between-group variance',
        fix:
          'No change to the delivery; an analyst may compare a single-level model, keeping in mind that even ICC .01 with about 50 ' +
          'records per group inflates type I error from .05 to about .11',
      },
      small: {
        message: '{column}: ICC {icc} (REML) is below {limit} but the groups do differ (F = {f}, {p}); design effect {deff}',
        fix:
          'No change to the delivery; small clustering still matters for standard errors, so keep the random intercept unless the ' +
          'analysis plan says otherwise',
      },
    },
    sources: [
      'LeBreton, J. M., & Senter, J. L. (2008). Organizational Research Methods, 11(4), 815–852: ICC(1) of .05 is small to medium',
      'Kreft, I., & de Leeuw, J. (1998). Introducing Multilevel Modeling: ICC .01 with ~50 per group raises α from .05 to about .11',
      'Snijders, T. A. B., & Bosker, R. J. (2012), §3.3.2: F-test for group differences',
    ],
  },
  check({ outcomes, params }) {
    const findings = [];
    for (const [column, s] of Object.entries(outcomes)) {
      const icc = s.reml.icc;
      if (!Number.isFinite(icc) || icc >= params.icc_below) continue;
      const data = {
        column,
        icc: formatNumber(icc, 3),
        f: formatNumber(s.anova.f, 3),
        df1: s.anova.df1,
        df2: s.anova.df2,
        p: pClause(s.anova.p),
        limit: params.icc_below,
        deff: formatNumber(s.designEffect, 2),
      };
      const significant = s.anova.p < params.alpha;
      findings.push({
        messageId: significant ? 'small' : 'none',
        severity: significant ? ('note' as const) : ('warning' as const),
        column,
        data,
      });
    }
    return findings;
  },
});
