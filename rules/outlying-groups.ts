import { groupIds, groupStat } from '../src/profile/group-stats.js';
import { defineRule } from '../src/rules/define.js';
import { listSome } from '../src/rules/describe.js';
import type { FindingDraft } from '../src/rules/types.js';
import { ebGroupEffects } from '../src/stats/eb-group-effects.js';
import { leaveOneOutIccs } from '../src/stats/leave-one-out-icc.js';
import type { GroupMoments } from '../src/stats/types.js';
import { formatNumber } from '../src/util/format.js';

interface Params {
  z_above: number;
  icc_change_above: number;
  examine: number;
}

/** A group examined: its ID, size, standardised effect and the ICC without it. */
interface Examined {
  id: string;
  n: number;
  z: number;
  iccWithout: number;
}

/** Groups far from the rest under the null model, and groups that alone move the ICC. */
export default defineRule<Params>({
  meta: {
    id: 'outlying-groups',
    title: 'Outlying or influential groups',
    level: 'variance',
    defaultSeverity: 'warning',
    description:
      'For each numeric outcome, the empirical-Bayes group effects of the REML null model standardised by their diagnostic ' +
      'standard deviation (the standardised residual of the group mean, standard normal when the model holds): groups beyond ' +
      '±z are listed with their sizes and the ICC refitted without each. Among the groups with the largest |z|, one whose ' +
      'removal alone moves the ICC by more than a threshold is noted as influential. A group far out is often a coding or ' +
      'unit error (minutes for hours, another site’s records); when it is real, the analysis plan decides what to do.',
    params: {
      type: 'object',
      properties: {
        z_above: {
          type: 'number',
          exclusiveMinimum: 0,
          default: 3,
          description: 'list groups whose standardised effect is beyond ±this (common practice)',
        },
        icc_change_above: {
          type: 'number',
          exclusiveMinimum: 0,
          maximum: 1,
          default: 0.05,
          description: 'note a group whose removal alone changes the REML ICC by more than this (common practice)',
        },
        examine: {
          type: 'integer',
          minimum: 1,
          default: 20,
          description: 'how many groups, largest |z| first, are refitted without (one REML fit each)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      outlying: {
        message: '{column}: {count} group(s) with a standardised empirical-Bayes effect beyond ±{limit} (REML ICC {icc}): {list}',
        fix:
          'Ask the sender to check the listed groups’ records (units, codes, another site’s rows); if they are right, the ' +
          'analysis plan decides whether to keep them (guidance, not a verdict)',
      },
      influential: {
        message: '{column}: leaving out one group alone moves the ICC from {icc} by more than {limit}: {list}',
        fix:
          'No change to the delivery unless the group’s records are wrong; report the ICC with and without it, as the ' +
          'analysis plan decides (guidance, not a verdict)',
      },
    },
    sources: [
      'Raudenbush, S. W., & Bryk, A. S. (2002). Hierarchical Linear Models (2nd ed.), ch. 3: empirical Bayes estimates',
      'Goldstein, H. (2011). Multilevel Statistical Models (4th ed.), ch. 2: diagnostic and comparative variances of residuals',
      'Langford, I. H., & Lewis, T. (1998). Outliers in multilevel data. JRSS A, 161(2), 121–160: standardised residuals and ' +
        'deleting level-2 units',
    ],
  },
  check({ profile, outcomes, params }) {
    const findings: FindingDraft[] = [];
    const ids = groupIds(profile.groups);
    for (const [column, s] of Object.entries(outcomes)) {
      if (!(s.reml.tau2 > 0)) continue;
      const counts = groupStat(profile.groups, column, 'numericCount');
      const means = groupStat(profile.groups, column, 'mean');
      const ss = groupStat(profile.groups, column, 'ss');
      const kept: number[] = [];
      for (let j = 0; j < ids.length; j++) if (counts[j] > 0) kept.push(j);
      const groups: GroupMoments[] = kept.map((j) => ({ n: counts[j], mean: means[j] as number, ss: Math.max(0, ss[j] as number) }));
      const effects = ebGroupEffects(groups, s.reml);
      const order = kept.map((_, i) => i).sort((a, b) => Math.abs(effects[b].z) - Math.abs(effects[a].z));
      const top = order.slice(0, params.examine);
      const without = leaveOneOutIccs(groups, top);
      const examined: Examined[] = top.map((i, k) => ({ id: ids[kept[i]], n: groups[i].n, z: effects[i].z, iccWithout: without[k] }));
      const outlying = order.filter((i) => Math.abs(effects[i].z) > params.z_above);
      const icc = formatNumber(s.reml.icc, 3);
      if (outlying.length) {
        const listed = outlying.map(
          (i) => examined.find((e) => e.id === ids[kept[i]]) ?? { id: ids[kept[i]], n: groups[i].n, z: effects[i].z },
        );
        findings.push({
          messageId: 'outlying',
          column,
          count: outlying.length,
          groups: listed.slice(0, 20).map((e) => e.id),
          data: { column, count: outlying.length, limit: params.z_above, icc, list: listSome(listed.map(describe)) },
        });
      }
      const moving = examined.filter(
        (e) => Math.abs(e.iccWithout - s.reml.icc) > params.icc_change_above && !(Math.abs(e.z) > params.z_above),
      );
      if (moving.length) {
        findings.push({
          messageId: 'influential',
          severity: 'note',
          column,
          count: moving.length,
          groups: moving.map((e) => e.id),
          data: { column, icc, limit: params.icc_change_above, list: listSome(moving.map(describe)) },
        });
      }
    }
    return findings;
  },
});

/** `G07 (n 12, z 4.21, ICC without it 0.081)`; groups beyond those refitted show no ICC. */
function describe(e: Omit<Examined, 'iccWithout'> & { iccWithout?: number }): string {
  const without = e.iccWithout === undefined ? '' : `, ICC without it ${formatNumber(e.iccWithout, 3)}`;
  return `${e.id} (n ${e.n}, z ${formatNumber(e.z, 2)}${without})`;
}
