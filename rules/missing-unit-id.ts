import { groupSizes, groupStat } from '../src/profile/group-stats.js';
import { defineRule } from '../src/rules/define.js';

/** A record without its unit ID still belongs to its group, but nothing can match it to its unit. */
export default defineRule<Record<string, never>>({
  meta: {
    id: 'missing-unit-id',
    title: 'Missing unit ID',
    level: 'data',
    defaultSeverity: 'warning',
    description:
      'Records whose unit ID (the declared `unit` column) is blank or one of the missing codes. The record ' +
      'still belongs to its group and enters the model, so this is a warning, not a blocker; but it cannot ' +
      'be matched to its unit: the checks for repeated, moved and variant unit IDs cannot see it, and a ' +
      'correction cannot be sent back by ID.',
    params: { type: 'object', properties: {}, additionalProperties: false },
    messages: {
      missing: {
        message: '{count} of {rows} records have no {column} (blank or a missing code; {groups} group(s) hold such records)',
        fix: 'Ask the sender to supply {column} for the listed records, so that each can be matched to its unit',
      },
    },
    sources: [
      'A unit ID identifies one level-1 unit; a record without one cannot be matched, checked for repeats or traced back (common practice)',
    ],
  },
  async check({ profile, roles, lookup }) {
    if (!roles.unit) return [];
    const column = roles.unit;
    // every record, those without a group included (missing-group-id flags those for their group)
    const count = profile.column(column).missing;
    if (count === 0) return [];
    // the groups are counted, not listed: a finding's `count` is read as its number of groups
    // whenever it lists some, and here it counts records (the problem rows name each one's group)
    const sizes = groupSizes(profile.groups);
    const present = groupStat(profile.groups, column, 'nonMissing');
    const groups = present.filter((k, i) => k < sizes[i]).length;
    return [
      {
        messageId: 'missing',
        column,
        count,
        data: { count, rows: profile.rows, column, groups },
        rows: await lookup.rowsMissing(column),
      },
    ];
  },
  rows: (finding, { records }) => {
    const column = finding.column;
    if (column === undefined || !records.has(column)) return null;
    return {
      query: records.missing(column),
      reason: () => `no ${column} (blank or a missing code): the record cannot be matched to its unit`,
    };
  },
});
