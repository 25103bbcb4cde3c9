import { defineRule } from '../src/rules/define.js';
import { listSome, recordId } from '../src/rules/describe.js';
import { describeSplit, parentSplits } from '../src/rules/parent-subsets.js';
import type { FoundRecord } from '../src/rules/rows.js';
import { listedRecords } from '../src/rules/rows.js';

interface Params {
  examine: number;
}

/** One group under two parents: the parent is wrong on some of its records. */
export default defineRule<Params>({
  meta: {
    id: 'group-in-several-parents',
    title: 'Group under more than one parent',
    level: 'structure',
    defaultSeverity: 'warning',
    description:
      'With `parent` declared, a group ID whose records name more than one parent, where the level-2 ' +
      'values agree across the parents (or no level-2 variable is declared to tell): most likely one ' +
      'group whose parent is wrong on some records. When the level-2 values differ between the parents ' +
      'the code is reused instead (see group-code-reused).',
    params: {
      type: 'object',
      properties: {
        examine: {
          type: 'integer',
          minimum: 1,
          default: 200,
          description: 'how many such groups to split by parent in the bounded look-up (the rest are counted here)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      split: {
        message: '{count} {group} value(s) appear under more than one {parent} and look like one group each ({how}): {splits}',
        fix: 'Ask the sender which {parent} each listed group belongs to and to correct the records under the other {parent}(s)',
      },
    },
    sources: [
      'Snijders, T. A. B., & Bosker, R. J. (2012). Multilevel Analysis (2nd ed.): in a nested design each group belongs to one ' +
        'higher-level unit (definition)',
      'split vs reused code told apart by the level-2 values of the parent subsets: heuristic',
    ],
  },
  async check({ profile, roles, params, lookup }) {
    if (!roles.parent) return [];
    const { total, examined } = await parentSplits(profile, roles, lookup, params.examine);
    const splits = examined.filter((s) => !s.differs);
    const unexamined = total - examined.length;
    const count = splits.length + unexamined;
    if (count === 0) return [];
    const how = roles.level2.length
      ? `their level-2 values agree across the ${roles.parent} values${unexamined ? `; ${unexamined} not examined` : ''}`
      : 'no level-2 variable is declared to tell a split group from a reused code';
    return [
      {
        messageId: 'split',
        column: roles.group,
        count,
        groups: splits.map((s) => s.group),
        rows: await lookup.rowsInGroups(splits.map((s) => s.group)),
        data: { count, group: roles.group, parent: roles.parent, how, splits: listSome(splits.map(describeSplit)) },
      },
    ];
  },
  // the records the finding lists, each naming its group and parent (IDs, so kept under --no-values)
  rows: (finding, { roles, records }) =>
    listedRecords(
      finding,
      records,
      roles.parent,
      (r: FoundRecord) =>
        `${roles.group} ${recordId(r.grp)} is under ${roles.parent} ${recordId(r.value)} here ` +
        `and under another ${roles.parent} on other records`,
    ),
});
