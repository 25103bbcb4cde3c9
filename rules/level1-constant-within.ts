import { groupStat } from '../src/profile/group-stats.js';
import { defineRule } from '../src/rules/define.js';
import type { FindingDraft } from '../src/rules/types.js';
import { groupRange } from '../src/rules/within.js';

interface Params {
  min_groups: number;
}

/** A "level-1" variable with one value per group is a group property (or a merge error). */
export default defineRule<Params>({
  meta: {
    id: 'level1-constant-within',
    title: 'Level-1 variable constant within every group',
    level: 'structure',
    defaultSeverity: 'warning',
    description:
      'A variable declared level-1 never varies within a group (in every group with two or more values ' +
      'it takes one value). It is then a property of the group: a level-2 variable mis-declared, or a ' +
      'group value merged onto every record where record values were expected. Its within-group effect ' +
      'cannot be estimated.',
    params: {
      type: 'object',
      properties: {
        min_groups: {
          type: 'integer',
          minimum: 1,
          default: 2,
          description: 'only judge a variable seen with two or more values in at least this many groups (common practice)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      between: {
        message:
          '{column} is declared level-1 but takes one value within each of the {groups} groups where it has 2+ values (it differs ' +
          'between groups): it is a property of the group',
        fix:
          'If {column} describes the group, declare it under level2 in the role map; otherwise ask the sender whether a merge ' +
          'copied a group value onto every record',
      },
      constant: {
        message:
          '{column} is declared level-1 but has the same value on every record ({groups} groups with 2+ values): it carries no information',
        fix: 'Ask the sender whether {column} was exported correctly; otherwise leave it out of the model',
      },
    },
    sources: [
      'Snijders, T. A. B., & Bosker, R. J. (2012). Multilevel Analysis (2nd ed.), §3.6 and §4.6: within- and between-group relations; ' +
        'a variable without within-group variation has only a between-group part',
      'min_groups 2: common practice',
    ],
  },
  check({ profile, roles, params }) {
    const findings: FindingDraft[] = [];
    for (const column of roles.level1) {
      const nn = groupStat(profile.groups, column, 'nonMissing');
      const { lo, hi } = groupRange(profile, column);
      const judged = nn.map((_, i) => i).filter((i) => nn[i] >= 2);
      if (judged.length < params.min_groups || judged.some((i) => lo[i] !== hi[i])) continue;
      const distinct = new Set(judged.map((i) => lo[i])).size;
      findings.push({
        messageId: distinct > 1 ? 'between' : 'constant',
        column,
        count: judged.length,
        data: { column, groups: judged.length },
      });
    }
    return findings;
  },
});
