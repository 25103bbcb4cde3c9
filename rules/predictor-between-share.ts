import { readsAsNumbers } from '../src/profile/reads-as-numbers.js';
import { defineRule } from '../src/rules/define.js';
import type { FindingDraft } from '../src/rules/types.js';
import { variableStats } from '../src/rules/variable-stats.js';
import { formatNumber } from '../src/util/format.js';

interface Params {
  decompose_from: number;
}

/** The between-group share of each level-1 predictor decides how to centre it. */
export default defineRule<Params>({
  meta: {
    id: 'predictor-between-share',
    title: 'Between-group share of each level-1 predictor',
    level: 'variance',
    defaultSeverity: 'note',
    description:
      'For every numeric level-1 variable, the share of its variance that lies between groups (its own ' +
      'ICC: REML null model and ANOVA ICC(1)). A clear share means the predictor has a group-level part ' +
      'whose effect can differ from the within-group effect: centre it within groups and add its group ' +
      'mean as a contextual variable. Near zero, grand-mean centering loses nothing. A predictor that does ' +
      'not vary within any group is all between: it is a group-level variable, with nothing to centre ' +
      'within groups. Reported for every predictor, as a note.',
    params: {
      type: 'object',
      properties: {
        decompose_from: {
          type: 'number',
          minimum: 0,
          maximum: 1,
          default: 0.05,
          description: 'advise within-group centering plus the group mean from this share (heuristic: no published cutoff)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      decompose: {
        message: '{column}: {share} of its variance lies between groups (REML ICC {reml}, ANOVA ICC(1) {anova})',
        fix:
          'Centre {column} within groups (x − group mean) and add its group mean as a level-2 (contextual) variable, so that ' +
          'within- and between-group effects are estimated separately',
      },
      groupLevel: {
        message:
          '{column}: all of its variance lies between groups; it does not vary within any group (REML ICC {reml}, ANOVA ICC(1) {anova})',
        fix:
          'Declare {column} under level2 in the role map: it is a group-level variable (centred within groups it would be zero on ' +
          'every record)',
      },
      small: {
        message: '{column}: only {share} of its variance lies between groups (REML ICC {reml}, ANOVA ICC(1) {anova})',
        fix: 'Grand-mean centering loses little for {column}; no change to the delivery is needed',
      },
    },
    sources: [
      'Kreft, I. G. G., de Leeuw, J., & Aiken, L. S. (1995). The effect of different forms of centering in hierarchical linear ' +
        'models. Multivariate Behavioral Research, 30(1), 1–21',
      'Enders, C. K., & Tofighi, D. (2007). Centering predictor variables in cross-sectional multilevel models. Psychological ' +
        'Methods, 12(2), 121–138',
      'Snijders, T. A. B., & Bosker, R. J. (2012). Multilevel Analysis (2nd ed.), §3.6 and §4.6: within- and between-group regressions',
      'decompose_from 0.05: heuristic (no published cutoff)',
    ],
  },
  check({ profile, roles, params }) {
    const findings: FindingDraft[] = [];
    for (const column of roles.level1) {
      const col = profile.column(column);
      if (!readsAsNumbers(col)) continue;
      const s = variableStats(profile, column);
      if (!Number.isFinite(s.reml.icc)) continue;
      // no within-group sum of squares: every group holds one value (level1-constant-within warns
      // of the same), so the share is all between; centred within groups it would be all zeros
      const groupLevel = s.anova.msw === 0;
      findings.push({
        messageId: groupLevel ? 'groupLevel' : s.reml.icc >= params.decompose_from ? 'decompose' : 'small',
        column,
        data: {
          column,
          share: `${formatNumber(100 * s.reml.icc, 1)}%`,
          reml: formatNumber(s.reml.icc, 3),
          anova: formatNumber(s.anova.icc, 3),
        },
      });
    }
    return findings;
  },
});
