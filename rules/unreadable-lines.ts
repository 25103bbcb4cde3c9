import { defineRule } from '../src/rules/define.js';
import type { RejectedLine } from '../src/rules/rows.js';

/** Lines the reader could not turn into a record are skipped: they must be counted and named. */
export default defineRule<Record<string, never>>({
  meta: {
    id: 'unreadable-lines',
    title: 'Unreadable lines',
    level: 'data',
    defaultSeverity: 'blocker',
    description:
      'Lines of the delivery that could not be read as a record (too many or too few fields, broken ' +
      'quoting). They are left out of every statistic, so the delivery as sent is not what was audited.',
    params: { type: 'object', properties: {}, additionalProperties: false },
    messages: {
      rejected: {
        message: '{count} line(s) could not be read and were left out: {lines}',
        fix:
          'Ask the sender to re-export the file so that every line has {columns} fields; the listed line numbers count the header ' +
          'as line 1',
      },
    },
    sources: ['common practice: nothing is dropped silently'],
  },
  check({ profile }) {
    const count = profile.rejected.length;
    if (count === 0) return [];
    const shown = profile.rejected.slice(0, 20).map((r) => `line ${r.line} (${r.reason})`);
    return [
      {
        messageId: 'rejected',
        count,
        data: {
          count,
          lines: shown.join('; ') + (count > shown.length ? `; … (+${count - shown.length} more)` : ''),
          columns: profile.header.length,
        },
      },
    ];
  },
  rows: (_finding, { rejected }) => ({
    lines: rejected,
    reason: (r: RejectedLine) => `line ${r.line} (the header is line 1) could not be read: ${r.reason}`,
  }),
});
