import { readsAsNumbers } from '../src/profile/reads-as-numbers.js';
import { defineRule } from '../src/rules/define.js';
import { percent } from '../src/rules/describe.js';
import type { FindingDraft } from '../src/rules/types.js';
import { binaryGroupsFromMoments, logisticNullModel, momentsAreZeroOne } from '../src/stats/logistic-null-model.js';
import { formatNumber } from '../src/util/format.js';

interface Params {
  min_groups: number;
  min_size: number;
}

/** A 0/1 outcome: report its clustering on the scale a logistic model uses, not only the linear ICC. */
export default defineRule<Params>({
  meta: {
    id: 'binary-outcome',
    title: 'Binary outcome: latent-scale ICC',
    level: 'variance',
    defaultSeverity: 'note',
    description:
      'For a 0/1 outcome (detected by the profile or declared `binary` in `types`), the ICC on the ' +
      'latent scale, τ²/(τ² + π²/3), from a random-intercept logistic null model fitted by maximum ' +
      'likelihood with adaptive Gauss–Hermite quadrature, beside the linear ICC of the 0/1 values, and ' +
      'the median odds ratio between groups. Binary outcomes need more groups and larger groups than ' +
      'continuous ones; the finding says so when the delivery is below the published guidance.',
    params: {
      type: 'object',
      properties: {
        min_groups: {
          type: 'integer',
          minimum: 1,
          default: 50,
          description: 'groups recommended for a multilevel logistic model (Moineddin et al. 2007: at least 50 groups of 50)',
        },
        min_size: {
          type: 'integer',
          minimum: 1,
          default: 50,
          description: 'mean records per group recommended (Moineddin et al. 2007)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      fit: {
        message:
          '{column} is 0/1 ({share} are 1; {extremes} of {groups} groups all 0 or all 1): latent-scale ICC {icc} (logistic random ' +
          'intercept, ML, τ² = {tau2}), median odds ratio {mor}; linear ICC of the 0/1 values {linear}',
        fix: 'No change to the delivery; model {column} with a logistic (or probit) random intercept rather than a linear one',
      },
      small: {
        message:
          '{column} is 0/1 ({share} are 1) with {groups} groups of {size} records on average, below the {minGroups} groups of ' +
          '{minSize} recommended for a multilevel logistic model; latent-scale ICC {icc} (τ² = {tau2}), median odds ratio {mor}; ' +
          'linear ICC {linear}',
        fix:
          'Expect the between-group variance of {column} to be biased with this many groups; ask whether more groups can be ' +
          'delivered, or report the fixed effects only',
      },
      degenerate: {
        message: '{column} is 0/1 but every record is {value}: no model of {column} can be fitted',
        fix: 'Ask the sender whether {column} was exported correctly',
      },
      notBinary: {
        message: '{column} is declared binary but has values other than 0 and 1 (from {min} to {max})',
        fix: 'Ask the sender how {column} is coded, or correct its entry under types in the role map',
      },
    },
    sources: [
      'Snijders, T. A. B., & Bosker, R. J. (2012). Multilevel Analysis (2nd ed.), chapter on discrete dependent variables: ' +
        'latent-scale ICC with level-1 variance π²/3',
      'Larsen, K., & Merlo, J. (2005). American Journal of Epidemiology, 161(1), 81–88: median odds ratio',
      'Pinheiro, J. C., & Bates, D. M. (1995). Journal of Computational and Graphical Statistics, 4(1), 12–35: adaptive Gauss–Hermite ' +
        'quadrature',
      'Moineddin, R., Matheson, F. I., & Glazier, R. H. (2007). A simulation study of sample size for multilevel logistic regression ' +
        'models. BMC Medical Research Methodology, 7, 34: at least 50 groups of 50',
    ],
  },
  check({ profile, roles, outcomes, params }) {
    const findings: FindingDraft[] = [];
    for (const column of roles.outcomes) {
      const col = profile.column(column);
      // no number at all (words whose 1 is not known): variable-without-statistics says so
      if (col.type !== 'binary' || !readsAsNumbers(col) || col.numericCount === 0) continue;
      const moments = profile.moments(column);
      if (!momentsAreZeroOne(moments) || (col.numMin ?? 0) < 0 || (col.numMax ?? 1) > 1) {
        findings.push({
          messageId: 'notBinary',
          severity: 'warning',
          column,
          data: { column, min: String(col.numMin), max: String(col.numMax) },
        });
        continue;
      }
      const counts = binaryGroupsFromMoments(moments);
      const n = counts.reduce((s, g) => s + g.n, 0);
      const ones = counts.reduce((s, g) => s + g.ones, 0);
      if (ones === 0 || ones === n) {
        findings.push({ messageId: 'degenerate', column, data: { column, value: ones === 0 ? 0 : 1 } });
        continue;
      }
      const fit = outcomes[column]?.logistic ?? logisticNullModel(counts);
      const linear = outcomes[column]?.reml.icc;
      const size = n / counts.length;
      const small = counts.length < params.min_groups || size < params.min_size;
      findings.push({
        messageId: small ? 'small' : 'fit',
        column,
        count: counts.length,
        data: {
          column,
          share: percent(ones / n),
          extremes: counts.filter((g) => g.ones === 0 || g.ones === g.n).length,
          groups: counts.length,
          size: formatNumber(size, 1),
          minGroups: params.min_groups,
          minSize: params.min_size,
          icc: formatNumber(fit.icc, 3),
          tau2: formatNumber(fit.tau2, 3),
          mor: formatNumber(fit.mor, 2),
          linear: linear === undefined ? 'n/a' : formatNumber(linear, 3),
        },
      });
    }
    return findings;
  },
});
