import { groupStat } from '../src/profile/group-stats.js';
import { readsAsNumbers } from '../src/profile/reads-as-numbers.js';
import { isNumberKind } from '../src/roles/types.js';
import { defineRule } from '../src/rules/define.js';
import { firstRows } from '../src/rules/describe.js';
import type { FoundRecord } from '../src/rules/rows.js';
import { listedRecords } from '../src/rules/rows.js';
import { showValue } from '../src/rules/show-value.js';
import type { FindingDraft } from '../src/rules/types.js';

interface Params {
  codes: number[];
  min_count: number;
  gap: number;
}

/** -9, -99, 999 …: codes for "missing" that a reader takes for real numbers. */
export default defineRule<Params>({
  meta: {
    id: 'sentinel-values',
    title: 'Missing-value codes read as numbers',
    level: 'data',
    defaultSeverity: 'warning',
    description:
      'A numeric column holds a typical missing-value code (-9, -99, -999, 999, 9999, …) that lies far ' +
      'outside the range of its other values and occurs repeatedly. Unless the code is listed under ' +
      '`missing`, it is read as a real value and distorts every statistic of the column. Only columns ' +
      'whose lowest or highest value in some group is such a code are looked at (from the profile).',
    params: {
      type: 'object',
      properties: {
        codes: {
          type: 'array',
          items: { type: 'number' },
          default: [-9999, -999, -99, -9, 99, 999, 9999],
          description: 'the values treated as possible codes (common practice)',
        },
        min_count: {
          type: 'integer',
          minimum: 1,
          default: 2,
          description: 'flag a code seen at least this often (common practice)',
        },
        gap: {
          type: 'number',
          minimum: 0,
          default: 0.5,
          description: 'flag a code only when its distance from the other values is at least this share of their range (heuristic)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      codes: {
        message:
          '{column}: {codes} look(s) like a missing-value code: far outside the other values and found {count} time(s) in all: {values}',
        fix:
          'If {codes} mean(s) missing, add {tokens} to `missing` in the role map (as written in the file) and ask the sender what ' +
          'each code means; until then they count as real values of {column}',
      },
    },
    sources: [
      'Codes such as -9, -99, -999, 999 and 9999 for missing values are a long-standing survey data convention (common practice); gap ' +
        'rule: heuristic',
    ],
  },
  async check({ profile, params, lookup }) {
    const findings: FindingDraft[] = [];
    const codes = new Set(params.codes);
    for (const column of profile.header) {
      const col = profile.column(column);
      if (!readsAsNumbers(col) || !isNumberKind(col.type)) continue;
      const lo = groupStat(profile.groups, column, 'numMin');
      const hi = groupStat(profile.groups, column, 'numMax');
      // a code outside the other values is the lowest or highest value of every group it is in
      if (!lo.some((v) => v !== null && codes.has(v)) && !hi.some((v) => v !== null && codes.has(v))) continue;
      const counts = await lookup.valueCounts(column, params.codes);
      const { otherMin, otherMax } = counts;
      const range = otherMin === null || otherMax === null ? 0 : otherMax - otherMin;
      const flagged = params.codes
        .map((code, i) => ({ code, count: counts.counts[i] }))
        .filter(({ code, count }) => {
          if (count < params.min_count) return false;
          if (otherMin === null || otherMax === null) return true; // nothing but codes
          const distance = code < otherMin ? otherMin - code : code > otherMax ? code - otherMax : 0;
          return distance > 0 && distance >= params.gap * range;
        });
      if (flagged.length === 0) continue;
      const rows = await Promise.all(flagged.map((f) => lookup.rowsWithValue(column, f.code)));
      const total = flagged.reduce((s, f) => s + f.count, 0);
      const others = otherMin === null ? 'no other values' : `other values ${otherMin} to ${otherMax}`;
      findings.push({
        messageId: 'codes',
        column,
        count: total,
        rows: firstRows(rows),
        values: flagged.map((f) => `${f.code} ×${f.count} (${others})`),
        data: {
          column,
          codes: flagged.map((f) => f.code).join(', '),
          tokens: flagged.map((f) => JSON.stringify(String(f.code))).join(', '),
          count: total,
        },
      });
    }
    return findings;
  },
  // the records the finding lists, each with the code it holds
  rows: (finding, { records, includeValues }) =>
    listedRecords(finding, records, finding.column, (r: FoundRecord) =>
      includeValues
        ? `${finding.column} holds ${showValue(r.value)}, far outside its other values: probably a missing-value code`
        : `${finding.column} holds a value far outside its other values, probably a missing-value code (values withheld)`,
    ),
});
