import { groupIds, groupSizes, groupStat } from '../src/profile/group-stats.js';
import { defineRule } from '../src/rules/define.js';
import type { FoundRecord } from '../src/rules/rows.js';
import { showValue } from '../src/rules/show-value.js';
import type { FindingDraft } from '../src/rules/types.js';
import { groupRange } from '../src/rules/within.js';

/** A group value present on some records and missing on others: the records without it are dropped. */
export default defineRule<Record<string, never>>({
  meta: {
    id: 'level2-partly-missing',
    title: 'Level-2 value missing on some records of a group',
    level: 'data',
    defaultSeverity: 'warning',
    description:
      'A declared level-2 variable is present on some records of a group and missing on others. A model ' +
      "drops the records without it although the group's value is known from its other records; where " +
      'those agree the fill is obvious, and the finding says which value.',
    params: { type: 'object', properties: {}, additionalProperties: false },
    messages: {
      partly: {
        message:
          '{column} (level-2) is missing on {missing} record(s) in {count} group(s) that have it on other records; the present values ' +
          'agree in {agree} of them: {values}',
        fix:
          "Ask the sender to fill {column} on the listed records with their group's value (listed where the group agrees), or to " +
          "confirm the group's value; until then a model drops those records",
      },
    },
    sources: [
      'van Buuren, S. (2018). Flexible Imputation of Missing Data (2nd ed.), §7.3: records with a missing level-2 predictor are ' +
        'deleted by default analyses',
    ],
  },
  async check({ profile, roles, lookup }) {
    const findings: FindingDraft[] = [];
    const ids = groupIds(profile.groups);
    const sizes = groupSizes(profile.groups);
    for (const column of roles.level2) {
      const nn = groupStat(profile.groups, column, 'nonMissing');
      const { lo, hi } = groupRange(profile, column);
      const partly = ids.map((_, i) => i).filter((i) => nn[i] > 0 && nn[i] < sizes[i]);
      if (partly.length === 0) continue;
      const agree = partly.filter((i) => lo[i] === hi[i]);
      const missing = partly.reduce((s, i) => s + sizes[i] - nn[i], 0);
      const groups = partly.map((i) => ids[i]);
      findings.push({
        messageId: 'partly',
        column,
        count: partly.length,
        groups,
        rows: await lookup.rowsMissingIn(column, groups),
        values: partly.map((i) =>
          lo[i] === hi[i] ? `${ids[i]}: ${lo[i]} (on ${nn[i]} of ${sizes[i]})` : `${ids[i]}: values disagree (on ${nn[i]} of ${sizes[i]})`,
        ),
        data: { column, count: partly.length, missing, agree: agree.length },
      });
    }
    return findings;
  },
  // the records the finding lists, each with the value its group's other records hold
  rows: (finding, { records, includeValues }) => {
    const column = finding.column;
    if (column === undefined || !finding.rows?.length || !records.has(column)) return null;
    return {
      query: records.listedWithGroupValue(finding.rows, column),
      reason: (r: FoundRecord) => {
        if (!includeValues) return `${column} is missing here but present on other records of the group (values withheld)`;
        if (r.expected === null || r.expected === undefined) return `${column} is missing here but present on other records of the group`;
        return `${column} is missing here; the other records of the group have ${showValue(r.expected)} (the most common value)`;
      },
    };
  },
});
