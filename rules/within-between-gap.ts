import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import { hasPair, pairMoments } from '../src/profile/pairs.js';
import { defineRule } from '../src/rules/define.js';
import { linearOutcomes } from '../src/rules/linear-outcomes.js';
import type { FindingDraft } from '../src/rules/types.js';
import { withinBetweenReml } from '../src/stats/within-between.js';
import { formatNumber, pClause } from '../src/util/format.js';

interface Params {
  alpha: number;
}

/** A random intercept on a raw level-1 predictor blends two slopes; when they differ, say so before the fit. */
export default defineRule<Params>({
  meta: {
    id: 'within-between-gap',
    title: 'Within- and between-group slopes differ',
    level: 'variance',
    defaultSeverity: 'note',
    description:
      'For each numeric level-1 variable and outcome that is not binary: the within-group slope (on the group-mean-centred ' +
      'variable) and the between-group slope (on its group mean) from a random-intercept model with both terms, fitted by REML ' +
      'from the one pass (a Mundlak-type regression), and their difference with its standard error. A clear gap means a model ' +
      'with the raw variable and a random intercept reports a blend of the two: centre it within groups and add its group ' +
      'mean (the contextual effect). At most 48 outcome × variable pairs are compared (planned random slopes first).',
    params: {
      type: 'object',
      properties: {
        alpha: {
          type: 'number',
          exclusiveMinimum: 0,
          maximum: 1,
          default: 0.05,
          description: 'a note when the gap is significant at this two-sided level (common practice: the conventional 5%)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      gap: {
        message:
          '{outcome} on {column}: within-group slope {within} (SE {seWithin}), between-group slope {between} (SE {seBetween}); ' +
          'the difference {gap} (SE {seGap}, z = {z}, {p}) is the contextual effect',
        fix:
          'No change to the delivery; guidance: centre {column} within groups and add its group mean to the model, so the ' +
          'within and between effects are estimated apart rather than blended; the analysis plan decides',
      },
    },
    sources: [
      'Mundlak, Y. (1978). On the pooling of time series and cross section data. Econometrica, 46(1), 69–85',
      'Enders, C. K., & Tofighi, D. (2007). Centering predictor variables in cross-sectional multilevel models. Psychological ' +
        'Methods, 12(2), 121–138',
      'Bell, A., & Jones, K. (2015). Explaining fixed effects: random effects modeling of time-series cross-sectional and panel ' +
        'data. Political Science Research and Methods, 3(1), 133–153',
      'alpha 0.05: common practice',
    ],
    profileNeeds: ['level1-pairs'],
  },
  check({ profile, roles, params, outcomes }) {
    const findings: FindingDraft[] = [];
    for (const outcome of linearOutcomes(profile, roles, outcomes)) {
      for (const column of roles.level1) {
        if (!hasPair(profile, outcome, column)) continue;
        const fit = withinBetweenReml(pairMoments(profile, outcome, column));
        if (!fit || !(fit.seGap > 0)) continue;
        const z = fit.gap / fit.seGap;
        const p = 2 * normalCdf(-Math.abs(z), 0, 1);
        if (!(p < params.alpha)) continue;
        const digits = 3;
        findings.push({
          messageId: 'gap',
          column,
          data: {
            outcome,
            column,
            within: formatNumber(fit.within, digits),
            seWithin: formatNumber(fit.seWithin, digits),
            between: formatNumber(fit.between, digits),
            seBetween: formatNumber(fit.seBetween, digits),
            gap: formatNumber(fit.gap, digits),
            seGap: formatNumber(fit.seGap, digits),
            z: formatNumber(z, 2),
            p: pClause(p),
          },
        });
      }
    }
    return findings;
  },
});
