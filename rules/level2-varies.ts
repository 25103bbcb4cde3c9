import { groupIds, groupStat } from '../src/profile/group-stats.js';
import { readsAsNumbers } from '../src/profile/reads-as-numbers.js';
import { defineRule } from '../src/rules/define.js';
import type { FoundRecord } from '../src/rules/rows.js';
import { showValue } from '../src/rules/show-value.js';

interface Params {
  tolerance: number;
}

/** A level-2 variable takes one value per group by definition; anything else is a data error. */
export default defineRule<Params>({
  meta: {
    id: 'level2-varies',
    title: 'Level-2 variable varies within a group',
    level: 'structure',
    defaultSeverity: 'blocker',
    description:
      'A variable declared as level-2 (a property of the group) takes more than one value inside a ' +
      'group. Either the records disagree about their group (a merge or entry error) or the variable ' +
      'is really level-1 and should be declared so and split into a group mean and a deviation.',
    params: {
      type: 'object',
      properties: {
        tolerance: {
          type: 'number',
          minimum: 0,
          default: 0,
          description: 'numeric variables: the largest within-group range still read as constant (rounding)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      varies: {
        message: '{column} is declared level-2 but takes more than one value in {count} group(s): {values}',
        fix: 'Ask the sender which {column} is right for each listed group and to correct the listed records so each group has one value',
      },
    },
    sources: [
      'Snijders, T. A. B., & Bosker, R. J. (2012). Multilevel Analysis (2nd ed.), ch. 2–3: a level-2 variable has one value per group ' +
        '(definition)',
      'Raudenbush, S. W., & Bryk, A. S. (2002). Hierarchical Linear Models (2nd ed.), ch. 2',
    ],
  },
  async check({ profile, roles, params, lookup }) {
    const findings = [];
    for (const column of roles.level2) {
      const col = profile.column(column);
      const numericType = readsAsNumbers(col);
      const ids = groupIds(profile.groups);
      const lo = numericType ? groupStat(profile.groups, column, 'numMin') : groupStat(profile.groups, column, 'textMin');
      const hi = numericType ? groupStat(profile.groups, column, 'numMax') : groupStat(profile.groups, column, 'textMax');
      const groups = ids.filter((_, i) => (numericType ? (hi[i] as number) - (lo[i] as number) > params.tolerance : lo[i] !== hi[i]));
      if (groups.length === 0) continue;
      const seen = await lookup.valuesInGroups(column, groups.slice(0, 20));
      const values = groups.slice(0, 20).map((g) => `${g}: ${(seen.get(g) ?? []).map((v) => `${v.value} ×${v.count}`).join(' / ')}`);
      findings.push({
        messageId: 'varies',
        column,
        count: groups.length,
        groups,
        values,
        data: { column, count: groups.length },
        rows: await lookup.rowsDeviating(column, groups, numericType ? params.tolerance : null),
      });
    }
    return findings;
  },
  // every record that departs from its group's most common value, in every group where it varies
  async rows(finding, { roles, params, records, includeValues }) {
    const column = finding.column;
    if (column === undefined || !records.has(column)) return null;
    const tolerance = (await records.readsAsNumber(column, roles.types[column])) ? params.tolerance : null;
    return {
      query: records.deviating(column, tolerance),
      reason: (r: FoundRecord) =>
        includeValues
          ? `${column} is ${showValue(r.value)} here but ${showValue(r.expected)} in most records of the group`
          : `${column} differs from the value in most records of the group (values withheld)`,
    };
  },
});
