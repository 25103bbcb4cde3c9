import { groupIds, groupStat } from '../src/profile/group-stats.js';
import type { Severity } from '../src/roles/types.js';
import { defineRule } from '../src/rules/define.js';
import { percent } from '../src/rules/describe.js';
import type { FindingDraft } from '../src/rules/types.js';
import { groupRange } from '../src/rules/within.js';

interface Params {
  warn_share: number;
}

/** Groups where every record has the same outcome: often a group value or an imputation copied down. */
export default defineRule<Params>({
  meta: {
    id: 'outcome-constant-within',
    title: 'Outcome constant within a group',
    level: 'variance',
    defaultSeverity: 'note',
    description:
      'Groups with two or more outcome values that are all equal (zero within-group variance). Real ' +
      'record-level outcomes rarely tie across a whole group; such groups often hold a group-level ' +
      'figure or a group mean filled in for every record, which inflates the ICC. 0/1 outcomes are ' +
      'left to binary-outcome, since all-0 and all-1 groups are expected there.',
    params: {
      type: 'object',
      properties: {
        warn_share: {
          type: 'number',
          minimum: 0,
          maximum: 1,
          default: 0.1,
          description: 'warning at or above this share of the groups with 2+ values (common practice)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      constant: {
        message: '{column}: {count} of {groups} groups with 2+ values ({share}) have the same value on every record: {values}',
        fix:
          'Ask the sender whether {column} in the listed groups was copied from a group-level figure or filled in (e.g. a group ' +
          'mean) rather than measured per record',
      },
    },
    sources: [
      'Snijders, T. A. B., & Bosker, R. J. (2012). Multilevel Analysis (2nd ed.), ch. 3: the within-group variance σ² of the outcome',
      'warn_share 0.1: common practice',
    ],
  },
  check({ profile, roles, params }) {
    const findings: FindingDraft[] = [];
    const ids = groupIds(profile.groups);
    for (const column of roles.outcomes) {
      const col = profile.column(column);
      if (col.type === 'binary') continue;
      const { lo, hi, asNumbers } = groupRange(profile, column);
      const counts = groupStat(profile.groups, column, asNumbers ? 'numericCount' : 'nonMissing');
      const judged = ids.map((_, i) => i).filter((i) => counts[i] >= 2);
      const constant = judged.filter((i) => lo[i] === hi[i]);
      if (constant.length === 0) continue;
      const share = constant.length / judged.length;
      const severity: Severity = share >= params.warn_share ? 'warning' : 'note';
      findings.push({
        messageId: 'constant',
        severity,
        column,
        count: constant.length,
        groups: constant.map((i) => ids[i]),
        values: constant.map((i) => `${ids[i]}: ${lo[i]} ×${counts[i]}`),
        data: { column, count: constant.length, groups: judged.length, share: percent(share) },
      });
    }
    return findings;
  },
});
