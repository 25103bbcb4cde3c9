import { commonGroups } from '../src/compare/group-index.js';
import { defineChange } from '../src/compare/types.js';
import type { FindingDraft } from '../src/rules/types.js';
import { hashText } from '../src/util/hash-text.js';

/** A group's level-2 value differs from the previous delivery's for the same group ID. */
export default defineChange({
  meta: {
    id: 'level2-value-changed',
    title: 'Level-2 value changed',
    level: 'structure',
    defaultSeverity: 'warning',
    description:
      "A declared level-2 variable takes another value in a group than it did in the previous delivery for the same group ID. A site's " +
      'attributes rarely change between deliveries; when they do silently, either the attribute was recoded or the ID now names ' +
      'another group. Groups where the value varies or is missing in either delivery are left to level2-varies and level2-partly-missing. ' +
      'With --no-values (in either delivery) values are compared by their hashes.',
    params: { type: 'object', properties: {}, additionalProperties: false },
    messages: {
      changed: {
        message: '{column} changed in {count} groups since the previous delivery: {values}',
        fix: 'Ask the sender whether {column} was recoded, or whether these group IDs now name other groups',
      },
    },
    sources: ['common practice'],
  },
  check({ previous, current, roles }) {
    const before = previous.report.snapshot;
    const now = current.snapshot;
    const hashed = before.values === 'hashed' || now.values === 'hashed';
    const comparable = (v: string | null | false, snapshotValues: 'raw' | 'hashed') =>
      typeof v === 'string' ? (hashed && snapshotValues === 'raw' ? hashText(v) : v) : null;
    const common = commonGroups(before, now);
    const out: FindingDraft[] = [];
    for (const column of roles.level2) {
      const old = before.groups.level2[column];
      const cur = now.groups.level2[column];
      if (!old || !cur) continue;
      const changed = common.filter(({ before: b, now: n }) => {
        const a = comparable(old[b], before.values);
        const c = comparable(cur[n], now.values);
        return a !== null && c !== null && a !== c;
      });
      if (!changed.length) continue;
      out.push({
        messageId: 'changed',
        column,
        data: { column, count: changed.length },
        count: changed.length,
        groups: changed.map((g) => g.id),
        // raw values only when both snapshots hold them; the engine withholds them under --no-values
        ...(!hashed && { values: changed.map((g) => `${g.id}: ${old[g.before]} → ${cur[g.now]}`) }),
      });
    }
    return out;
  },
});
