import { defineRule } from '../src/rules/define.js';
import { listSome, recordId } from '../src/rules/describe.js';
import { describeSplit, parentSplits } from '../src/rules/parent-subsets.js';
import type { FoundRecord } from '../src/rules/rows.js';
import { listedRecords } from '../src/rules/rows.js';

interface Params {
  examine: number;
}

/** One code used by two parents for two different groups: the group ID is only unique within the parent. */
export default defineRule<Params>({
  meta: {
    id: 'group-code-reused',
    title: 'Group code reused by different parents',
    level: 'structure',
    defaultSeverity: 'blocker',
    description:
      'With `parent` declared, a group ID used under more than one parent for groups that differ: a ' +
      "level-2 variable is constant within each parent's records but takes different values between " +
      'them. The IDs are then only unique within the parent, and a model keyed on the group ID alone ' +
      'merges different groups into one.',
    params: {
      type: 'object',
      properties: {
        examine: {
          type: 'integer',
          minimum: 1,
          default: 200,
          description: 'how many groups under several parents to split by parent in the bounded look-up',
        },
      },
      additionalProperties: false,
    },
    messages: {
      reused: {
        message:
          '{count} {group} value(s) are used by more than one {parent} for different groups ({column} differs between them): ' +
          '{splits}; values: {values}',
        fix:
          'Key the groups by {parent} and {group} together (a composite ID such as "{parent}/{group}" as the group column), or ask ' +
          'the sender for group IDs that are unique across {parent}',
      },
    },
    sources: [
      'Snijders, T. A. B., & Bosker, R. J. (2012). Multilevel Analysis (2nd ed.): a level-2 variable has one value per group, so ' +
        'different values mean different groups (definition)',
      'reused code inferred from level-2 values that differ between parent subsets: heuristic',
    ],
  },
  async check({ profile, roles, params, lookup }) {
    if (!roles.parent) return [];
    const { examined } = await parentSplits(profile, roles, lookup, params.examine);
    const reused = examined.flatMap((s) => (s.differs ? [{ ...s, differs: s.differs }] : []));
    if (reused.length === 0) return [];
    const columns = [...new Set(reused.map((s) => s.differs.column))];
    return [
      {
        messageId: 'reused',
        column: roles.group,
        count: reused.length,
        groups: reused.map((s) => s.group),
        rows: await lookup.rowsInGroups(reused.map((s) => s.group)),
        values: reused.map((s) => `${s.group}: ${s.differs.column} ${s.differs.values.join(' / ')}`),
        data: {
          count: reused.length,
          group: roles.group,
          parent: roles.parent,
          column: columns.join(', '),
          splits: listSome(reused.map(describeSplit)),
        },
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
        `${roles.group} ${recordId(r.grp)} under ${roles.parent} ${recordId(r.value)} here: ` +
        `another ${roles.parent} uses the same code for a different group`,
    ),
});
