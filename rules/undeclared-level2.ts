import { groupStat } from '../src/profile/group-stats.js';
import { defineRule } from '../src/rules/define.js';
import type { FindingDraft } from '../src/rules/types.js';
import { groupRange } from '../src/rules/within.js';

interface Params {
  min_groups: number;
}

/** A column the role map does not name that behaves like a group property. */
export default defineRule<Params>({
  meta: {
    id: 'undeclared-level2',
    title: 'Undeclared column constant within groups',
    level: 'structure',
    defaultSeverity: 'note',
    description:
      'A column not named in the role map takes one value within every group (in each group with two ' +
      'or more values) and differs between groups: a possible level-2 variable. Declaring it lets ' +
      'level2-varies check it and keeps it out of record-level analyses by mistake.',
    params: {
      type: 'object',
      properties: {
        min_groups: {
          type: 'integer',
          minimum: 1,
          default: 2,
          description: 'only judge a column seen with two or more values in at least this many groups (common practice)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      candidate: {
        message:
          '{column} is not in the role map and is constant within each of the {groups} groups where it has 2+ values: it may be a ' +
          'level-2 variable',
        fix: 'If {column} describes the group, add it to level2 in the role map so its constancy is checked; otherwise no change is needed',
      },
    },
    sources: [
      'Snijders, T. A. B., & Bosker, R. J. (2012). Multilevel Analysis (2nd ed.), ch. 2–3: a level-2 variable has one value per group ' +
        '(definition)',
    ],
  },
  check({ profile, params }) {
    const findings: FindingDraft[] = [];
    for (const column of profile.header) {
      const col = profile.column(column);
      if (col.role !== 'other') continue;
      const nn = groupStat(profile.groups, column, 'nonMissing');
      const { lo, hi } = groupRange(profile, column);
      const judged = nn.map((_, i) => i).filter((i) => nn[i] >= 2);
      if (judged.length < params.min_groups || judged.some((i) => lo[i] !== hi[i])) continue;
      if (new Set(judged.map((i) => lo[i])).size < 2) continue; // one value everywhere: not a group property
      findings.push({ messageId: 'candidate', column, count: judged.length, data: { column, groups: judged.length } });
    }
    return findings;
  },
});
