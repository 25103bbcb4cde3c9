import { groupStat } from '../src/profile/group-stats.js';
import { defineRule } from '../src/rules/define.js';
import type { FindingDraft } from '../src/rules/types.js';
import { informativeSize } from '../src/stats/informative-size.js';
import { formatNumber, pClause } from '../src/util/format.js';

interface Params {
  alpha: number;
  permutations: number;
}

/** Fixed, so that the same delivery always gets the same p-value. */
const SEED = 20240611;

/** Larger groups with other outcomes than smaller ones: the average record is not the average group. */
export default defineRule<Params>({
  meta: {
    id: 'informative-group-size',
    title: 'Group size goes with the outcome',
    level: 'variance',
    defaultSeverity: 'note',
    description:
      'For each numeric outcome, the correlation of group size with group mean and the difference between the ' +
      'record-weighted and the group-weighted mean, with a permutation p-value (sizes permuted over groups, a fixed seed; ' +
      'every permutation when there are few groups). When size is informative, the average over records and the average ' +
      'over groups are different quantities, and a random-intercept model estimates neither exactly: the analysis must ' +
      'say which one it targets.',
    params: {
      type: 'object',
      properties: {
        alpha: {
          type: 'number',
          exclusiveMinimum: 0,
          maximum: 1,
          default: 0.05,
          description: 'level of the permutation test (common practice)',
        },
        permutations: {
          type: 'integer',
          minimum: 99,
          maximum: 100000,
          default: 2000,
          description:
            'most random permutations drawn (with fewer groups, all J! are enumerated when that is no more); they stop once 20 ' +
            'permuted gaps reach the observed one (Besag & Clifford 1991)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      informative: {
        message:
          '{column}: group size goes with the group mean (r = {r}); the record-weighted mean {recordMean} differs from the ' +
          'group-weighted mean {groupMean} by {gap} (permutation test, {how}, {p})',
        fix:
          'No change to the delivery; the analysis plan should say whether it targets the average record or the average group ' +
          'and weight accordingly (guidance, not a verdict)',
      },
    },
    sources: [
      'Kahan, B. C., Li, F., Copas, A. J., & Harhay, M. O. (2023). Estimands in cluster-randomized trials: choosing analyses ' +
        'that answer the right question. International Journal of Epidemiology, 52(1), 107–118',
      'Phipson, B., & Smyth, G. K. (2010). Permutation p-values should never be zero. Stat. Appl. Genet. Mol. Biol., 9(1), ' +
        'article 39: p = (1 + hits)/(1 + B)',
      'Hoeffding, W. (1951). A combinatorial central limit theorem. Annals of Mathematical Statistics, 22(4), 558–566: ' +
        'the normal approximation from 1,000 groups on (common practice for the threshold)',
      'Besag, J., & Clifford, P. (1991). Sequential Monte Carlo p-values. Biometrika, 78(2), 301–304: stop after h = 20 ' +
        'exceedances, p = h / L',
    ],
  },
  check({ profile, outcomes, params }) {
    const findings: FindingDraft[] = [];
    for (const [column, s] of Object.entries(outcomes)) {
      const counts = groupStat(profile.groups, column, 'numericCount');
      const groupMeans = groupStat(profile.groups, column, 'mean');
      const sizes: number[] = [];
      const means: number[] = [];
      for (let j = 0; j < counts.length; j++) {
        if (counts[j] > 0) {
          sizes.push(counts[j]);
          means.push(groupMeans[j] as number);
        }
      }
      if (sizes.length < 3) continue;
      const r = informativeSize(sizes, means, { permutations: params.permutations, seed: SEED });
      if (!Number.isFinite(r.correlation) || !(r.p < params.alpha)) continue;
      const groupMean = means.reduce((a, b) => a + b, 0) / means.length;
      findings.push({
        messageId: 'informative',
        column,
        data: {
          column,
          r: formatNumber(r.correlation, 3),
          recordMean: formatNumber(s.mean, 3),
          groupMean: formatNumber(groupMean, 3),
          gap: formatNumber(r.gap, 3),
          how: r.exact
            ? `all ${r.permutations} permutations`
            : r.normal
              ? 'the normal approximation to the permutations'
              : `${r.permutations} permutations, seed ${SEED}`,
          p: pClause(r.p),
        },
      });
    }
    return findings;
  },
});
