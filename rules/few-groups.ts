import { defineRule } from '../src/rules/define.js';

interface Params {
  block_below: number;
  warn_below: number;
  note_below: number;
}

/** Too few groups: the between-group variance and its standard error cannot be estimated well. */
export default defineRule<Params>({
  meta: {
    id: 'few-groups',
    title: 'Too few groups',
    level: 'structure',
    defaultSeverity: 'warning',
    description:
      'The number of groups against published guidance. Few groups bias the standard errors of the ' +
      'level-2 variance and can put its estimate on the boundary (zero). These are rules of thumb, not ' +
      'law: a power analysis or the study analysis plan takes precedence.',
    params: {
      type: 'object',
      properties: {
        block_below: {
          type: 'integer',
          minimum: 1,
          default: 10,
          description: 'blocker below this many groups (CMM Bristol: with about 10 groups the level-2 variance may be estimated as 0)',
        },
        warn_below: {
          type: 'integer',
          minimum: 1,
          default: 30,
          description: 'warning below this many groups (30 groups: Kreft 1996, as cited in Hox 2010)',
        },
        note_below: {
          type: 'integer',
          minimum: 1,
          default: 50,
          description: 'note at or below this many groups (Maas & Hox 2005: 50 or fewer bias level-2 standard errors)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      floor: {
        message:
          'only {count} groups (fewer than {limit}): the level-2 variance may be estimated as 0 and its standard error is unreliable',
        fix:
          'Ask whether more groups can be delivered or deliveries pooled; otherwise plan a fixed-effects or cluster-robust ' +
          'analysis instead of a random intercept',
      },
      usual: {
        message:
          '{count} groups, fewer than the usual recommendation of {limit}: fixed effects are fine but level-2 variance estimates and ' +
          'their standard errors are fragile (guidance, not law)',
        fix:
          'Check the study analysis plan; if it relies on level-2 variance estimates, use REML with a small-sample correction ' +
          '(Kenward–Roger) or add groups',
      },
      strict: {
        message: '{count} groups, at or below {limit}: standard errors of level-2 variances tend to be too small (guidance, not law)',
        fix: 'Interpret level-2 variance standard errors with care; no change to the delivery is needed',
      },
    },
    sources: [
      'Centre for Multilevel Modelling, University of Bristol, "Sample sizes for multilevel models": with about 10 groups the level-2 ' +
        'variance may be estimated as 0',
      'Kreft, I. G. G. (1996), as cited in Hox, J. J. (2010), Multilevel Analysis (2nd ed.): at least 30 groups',
      'Maas, C. J. M., & Hox, J. J. (2005). Sufficient sample sizes for multilevel modeling. Methodology, 1(3), 86–92: 50 or fewer ' +
        'groups bias level-2 standard errors',
      'McNeish, D. (2017). Multivariate Behavioral Research, 52(5), 661–670: REML with the Kenward–Roger correction for few clusters',
    ],
  },
  check({ profile, params }) {
    const count = profile.groups.numRows();
    if (count < params.block_below) {
      return [{ messageId: 'floor', severity: 'blocker', count, data: { count, limit: params.block_below } }];
    }
    if (count < params.warn_below) {
      return [{ messageId: 'usual', severity: 'warning', count, data: { count, limit: params.warn_below } }];
    }
    if (count <= params.note_below) {
      return [{ messageId: 'strict', severity: 'note', count, data: { count, limit: params.note_below } }];
    }
    return [];
  },
});
