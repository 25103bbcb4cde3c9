import { defineRule } from '../src/rules/define.js';
import { formatNumber } from '../src/util/format.js';

interface Params {
  per_predictor: number;
}

/** Level-2 predictors spend groups the way predictors spend cases in a single-level regression. */
export default defineRule<Params>({
  meta: {
    id: 'groups-per-level2-predictor',
    title: 'Groups per level-2 predictor',
    level: 'structure',
    defaultSeverity: 'warning',
    description:
      'The number of groups per declared level-2 variable. Tests of level-2 effects have J − q − 1 ' +
      'degrees of freedom (J groups, q level-2 predictors), so each predictor spends a group. The ' +
      'ten-per-predictor line is a heuristic by analogy with events per variable in logistic regression, ' +
      'not a published multilevel rule. A categorical variable with k categories spends k − 1.',
    params: {
      type: 'object',
      properties: {
        per_predictor: {
          type: 'number',
          exclusiveMinimum: 0,
          default: 10,
          description: 'warning below this many groups per level-2 variable (heuristic by analogy with Peduzzi et al. 1996)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      none: {
        message:
          '{groups} groups for {q} level-2 variable(s): the level-2 effects have J − q − 1 = {df} degrees of freedom, so they cannot ' +
          'all be estimated',
        fix: 'Ask whether more groups can be delivered, or enter fewer level-2 variables in the model',
      },
      few: {
        message:
          '{groups} groups for {q} level-2 variable(s) ({ratio} per variable, below the heuristic {limit}): level-2 effects are ' +
          'tested on {df} degrees of freedom',
        fix: 'No change to the delivery; enter fewer level-2 variables at once, or treat their tests as exploratory',
      },
    },
    sources: [
      'Raudenbush, S. W., & Bryk, A. S. (2002). Hierarchical Linear Models (2nd ed.), ch. 3: t-tests of level-2 coefficients on J − q ' +
        '− 1 df',
      'Peduzzi, P., et al. (1996). A simulation study of the number of events per variable in logistic regression analysis. Journal ' +
        'of Clinical Epidemiology, 49(12), 1373–1379 (the analogy; heuristic by analogy, no multilevel source)',
    ],
  },
  check({ profile, roles, params }) {
    const q = roles.level2.length;
    if (q === 0) return [];
    const groups = profile.groups.numRows();
    const df = groups - q - 1;
    const ratio = groups / q;
    if (df < 1) return [{ messageId: 'none', severity: 'blocker', count: groups, data: { groups, q, df } }];
    if (ratio >= params.per_predictor) return [];
    return [{ messageId: 'few', count: groups, data: { groups, q, df, ratio: formatNumber(ratio, 1), limit: params.per_predictor } }];
  },
});
