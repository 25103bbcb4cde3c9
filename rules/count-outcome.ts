import { defineRule } from '../src/rules/define.js';
import type { FindingDraft } from '../src/rules/types.js';
import { formatNumber, pClause } from '../src/util/format.js';

interface Params {
  max_dispersion: number;
  alpha: number;
  max_zero_ratio: number;
}

/** A count outcome: its clustering on the scale a Poisson model uses, and whether a Poisson model fits its records. */
export default defineRule<Params>({
  meta: {
    id: 'count-outcome',
    title: 'Count outcome: Poisson null model, dispersion and zeros',
    level: 'variance',
    defaultSeverity: 'note',
    description:
      'For an outcome declared `count`, the random-intercept Poisson null model fitted by maximum likelihood with adaptive ' +
      'Gauss–Hermite quadrature: τ² on the log scale and the latent-scale ICC (lognormal approximation). Then two checks of ' +
      'whether a Poisson model suits the records: the index of dispersion within groups, pooled, against its χ² reference (counts ' +
      'that vary more than a Poisson allows give too small standard errors), and the zeros observed against those the fitted ' +
      'model expects (an excess points at zero inflation). Values that are not whole numbers ≥ 0 are reported instead.',
    params: {
      type: 'object',
      properties: {
        max_dispersion: {
          type: 'number',
          exclusiveMinimum: 1,
          default: 1.5,
          description:
            'dispersion ratio D/df above which, with a significant χ² test, the counts are called overdispersed (common practice; ' +
            'a ratio of 1 is what a Poisson gives)',
        },
        alpha: {
          type: 'number',
          exclusiveMinimum: 0,
          exclusiveMaximum: 1,
          default: 0.05,
          description: 'significance level of the χ² test of dispersion (common practice)',
        },
        max_zero_ratio: {
          type: 'number',
          exclusiveMinimum: 1,
          default: 1.5,
          description: 'observed zeros over those the fitted model expects, above which zeros are called in excess (common practice)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      fit: {
        message:
          '{column} is a count ({records} records, {zeros} zeros): Poisson random intercept (ML) β0 = {intercept}, τ² = {tau2} on the ' +
          'log scale, latent-scale ICC {icc} (lognormal approximation); within-group dispersion {ratio} ({dispersionP}); linear ICC ' +
          'of the counts {linear}',
        fix:
          'No change to the delivery; model {column} with a count model (Poisson or negative binomial random intercept) rather ' +
          'than a linear one',
      },
      overdispersed: {
        message:
          '{column} varies {ratio} times as much within groups as Poisson counts would (D = {statistic} on {df} df, {dispersionP}): a ' +
          'Poisson random-intercept model would give too small standard errors; this is guidance, the analysis plan decides the model',
        fix:
          'No change to the delivery; tell the analyst to consider a negative binomial model or an observation-level random effect ' +
          'for {column}',
      },
      excessZeros: {
        message:
          '{column} has {observed} zeros where the fitted Poisson random-intercept model expects {expected} (ratio {ratio}): more ' +
          'zeros than the model allows; this is guidance, the analysis plan decides the model',
        fix:
          'Ask the sender whether a 0 in {column} can also mean "not recorded"; otherwise tell the analyst to consider a ' +
          'zero-inflated or hurdle model',
      },
      notCount: {
        message: '{column} is declared a count but {count} of its values are not whole numbers ≥ 0 (from {min} to {max})',
        fix: 'Ask the sender how {column} is coded, or correct its entry under types in the role map',
      },
      degenerate: {
        message: '{column} is declared a count but every value is 0: no model of {column} can be fitted',
        fix: 'Ask the sender whether {column} was exported correctly',
      },
    },
    sources: [
      'Pinheiro, J. C., & Bates, D. M. (1995). Journal of Computational and Graphical Statistics, 4(1), 12–35: adaptive Gauss–Hermite ' +
        'quadrature',
      'Nakagawa, S., Johnson, P. C. D., & Schielzeth, H. (2017). The coefficient of determination R² and intra-class correlation ' +
        'coefficient from generalized linear mixed-effects models revisited and expanded. Journal of the Royal Society Interface, ' +
        '14(134), 20170213: latent-scale ICC of a Poisson model, lognormal approximation ln(1 + 1/λ)',
      'Fisher, R. A. (1950). The significance of deviations from expectation in a Poisson series. Biometrics, 6(1), 17–24: the ' +
        'index of dispersion and its χ² reference',
      'Harrison, X. A. (2014). Using observation-level random effects to model overdispersion in count data in ecology and ' +
        'evolution. PeerJ, 2, e616',
      'Thresholds of the dispersion ratio and of the zero ratio: common practice',
    ],
  },
  check({ profile, roles, outcomes, params }) {
    const findings: FindingDraft[] = [];
    for (const column of roles.outcomes) {
      const p = outcomes[column]?.poisson;
      if (roles.types[column] !== 'count' || !p) continue;
      const col = profile.column(column);
      if (p.nonCounts) {
        findings.push({
          messageId: 'notCount',
          severity: 'warning',
          column,
          count: p.nonCounts,
          data: { column, count: p.nonCounts, min: String(col.numMin), max: String(col.numMax) },
        });
        continue;
      }
      const records = outcomes[column].n;
      if (p.zeros.observed === records) {
        findings.push({ messageId: 'degenerate', column, data: { column } });
        continue;
      }
      const d = p.dispersion;
      const dispersionP = pClause(d.p);
      findings.push({
        messageId: 'fit',
        column,
        count: outcomes[column].groups,
        data: {
          column,
          records,
          zeros: p.zeros.observed,
          intercept: formatNumber(p.intercept, 3),
          tau2: formatNumber(p.tau2, 3),
          icc: formatNumber(p.latentIcc, 3),
          ratio: formatNumber(d.ratio, 2),
          dispersionP,
          linear: formatNumber(outcomes[column].reml.icc, 3),
        },
      });
      if (d.ratio > params.max_dispersion && d.p < params.alpha) {
        findings.push({
          messageId: 'overdispersed',
          severity: 'warning',
          column,
          data: { column, ratio: formatNumber(d.ratio, 2), statistic: formatNumber(d.statistic, 1), df: d.df, dispersionP },
        });
      }
      const zeroRatio = p.zeros.observed / p.zeros.expected;
      if (zeroRatio > params.max_zero_ratio) {
        findings.push({
          messageId: 'excessZeros',
          severity: 'warning',
          column,
          count: p.zeros.observed,
          data: {
            column,
            observed: p.zeros.observed,
            expected: formatNumber(p.zeros.expected, 1),
            ratio: formatNumber(zeroRatio, 2),
          },
        });
      }
    }
    return findings;
  },
});
