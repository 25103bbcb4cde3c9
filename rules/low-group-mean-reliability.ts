import { readsAsNumbers } from '../src/profile/reads-as-numbers.js';
import { defineRule } from '../src/rules/define.js';
import type { FindingDraft } from '../src/rules/types.js';
import type { VariableStats } from '../src/rules/variable-stats.js';
import { variableStats } from '../src/rules/variable-stats.js';
import { formatNumber } from '../src/util/format.js';

interface Params {
  reliability_below: number;
}

/** Group means that are mostly noise: a problem wherever they are used as contextual variables or to rank groups. */
export default defineRule<Params>({
  meta: {
    id: 'low-group-mean-reliability',
    title: 'Unreliable group means',
    level: 'variance',
    defaultSeverity: 'note',
    description:
      'The mean reliability of the group means, τ²/(τ² + σ²/n_j) averaged over groups (REML), with ' +
      'ICC(2) from the ANOVA, for each numeric outcome and numeric level-1 variable. When it is low, ' +
      'observed group means used as contextual (level-2) predictors bias their effects and understate ' +
      'their standard errors, and rankings of groups by their means are mostly noise.',
    params: {
      type: 'object',
      properties: {
        reliability_below: {
          type: 'number',
          minimum: 0,
          maximum: 1,
          default: 0.7,
          description: 'note below this mean reliability (.70 as commonly attributed, not verified; Fleiss 1986 calls > .75 excellent)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      low: {
        message:
          '{column}: the group means have mean reliability {reliability} (ICC(2) {icc2}), below {limit}, with {size} records per ' +
          'group on average',
        fix:
          'No change to the delivery; if group means of {column} enter the model as contextual variables, use a latent-covariate ' +
          'model rather than the observed means, or interpret them with care',
      },
    },
    sources: [
      'Raudenbush, S. W., & Bryk, A. S. (2002). Hierarchical Linear Models (2nd ed.), eq. 3.58: reliability of the group means',
      'Bliese, P. D. (2000), in Klein & Kozlowski (eds.), Multilevel Theory, Research, and Methods in Organizations, pp. 349–381: ICC(2)',
      'Lüdtke, O., et al. (2008). The multilevel latent covariate model. Psychological Methods, 13(3), 203–229: unreliable observed ' +
        'group means bias contextual effects',
      '.70 cutoff as commonly attributed (unverified); Fleiss, J. L. (1986). The Design and Analysis of Clinical Experiments: ' +
        'reliability > .75 excellent',
    ],
  },
  check({ profile, roles, outcomes, params }) {
    const findings: FindingDraft[] = [];
    const stats = new Map<string, VariableStats>();
    for (const [name, s] of Object.entries(outcomes)) if (profile.column(name).type === 'numeric') stats.set(name, s);
    for (const name of roles.level1) {
      const col = profile.column(name);
      if (!readsAsNumbers(col) || col.type !== 'numeric') continue;
      const s = variableStats(profile, name);
      // without between-group variance nobody uses the group means: predictor-between-share says so
      if (s.reml.tau2 > 0) stats.set(name, s);
    }
    for (const [column, s] of stats) {
      if (!(s.meanReliability < params.reliability_below)) continue;
      findings.push({
        messageId: 'low',
        column,
        data: {
          column,
          reliability: formatNumber(s.meanReliability, 2),
          icc2: formatNumber(s.anova.icc2, 2),
          limit: params.reliability_below,
          size: formatNumber(s.n / s.groups, 1),
        },
      });
    }
    return findings;
  },
});
