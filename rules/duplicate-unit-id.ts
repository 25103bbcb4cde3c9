import { defineRule } from '../src/rules/define.js';
import { firstRows, listSome, quoteId } from '../src/rules/describe.js';
import type { FoundRecord } from '../src/rules/rows.js';
import type { FindingDraft } from '../src/rules/types.js';

/** A unit ID names one record; repeats are either re-sent copies or different records sharing an ID. */
export default defineRule<Record<string, never>>({
  meta: {
    id: 'duplicate-unit-id',
    title: 'Repeated unit ID',
    level: 'data',
    defaultSeverity: 'blocker',
    description:
      'A unit ID (the declared `unit` column) on more than one record, in the same group or not. ' +
      'Records that are exact copies of each other (every column equal) are reported apart from IDs ' +
      'shared by records that differ: copies double-count a unit, differing records mean the ID does ' +
      'not identify the unit.',
    params: { type: 'object', properties: {}, additionalProperties: false },
    messages: {
      conflicting: {
        message: '{count} {column} value(s) are on several records that differ ({records} records): {ids}',
        fix: 'Ask the sender which record is right for each listed {column}, or for IDs that are unique per unit',
      },
      copies: {
        message: '{count} {column} value(s) have exact duplicate records ({copies} extra record(s), every column equal): {ids}',
        fix: 'Ask the sender to confirm the listed records were sent twice, then keep one of each (drop the later copies)',
      },
    },
    sources: ['A unit ID identifies one level-1 unit; in a two-level design each unit is one record (common practice)'],
    prefetch: ['unit-ids'],
  },
  async check({ roles, lookup }) {
    if (!roles.unit) return [];
    const column = roles.unit;
    const { conflicting, copied } = await lookup.unitIds(column);
    const findings: FindingDraft[] = [];
    const ids = (list: typeof conflicting.examples) => listSome(list.map((x) => `${quoteId(x.id)} (${x.count} records)`));
    if (conflicting.ids > 0) {
      findings.push({
        messageId: 'conflicting',
        column,
        count: conflicting.ids,
        rows: firstRows(conflicting.examples.map((x) => x.rows)),
        data: { count: conflicting.ids, column, records: conflicting.records, ids: ids(conflicting.examples) },
      });
    }
    if (copied.ids > 0) {
      findings.push({
        messageId: 'copies',
        severity: 'warning',
        column,
        count: copied.ids,
        rows: firstRows(copied.examples.map((x) => x.rows)),
        data: { count: copied.ids, column, copies: copied.copies, ids: ids(copied.examples) },
      });
    }
    return findings;
  },
  // the records the finding lists, each naming its repeated ID (an ID, so kept under --no-values)
  rows: (finding, { records }) => {
    const column = finding.column;
    if (column === undefined || !finding.rows?.length) return null;
    return {
      query: records.listed(finding.rows),
      reason: (r: FoundRecord) => `${column} ${r.unit === null ? '(missing)' : quoteId(r.unit)} is on more than one record of the delivery`,
    };
  },
});
