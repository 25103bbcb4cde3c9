import { defineChange } from '../src/compare/types.js';
import type { FindingDraft } from '../src/rules/types.js';

/** Columns added, dropped or read as another type than in the previous delivery. */
export default defineChange({
  meta: {
    id: 'columns-changed',
    title: 'Columns added, dropped or retyped',
    level: 'data',
    defaultSeverity: 'warning',
    description:
      "The delivery's columns against the previous delivery's: a column added (a note), a column dropped, or a column whose values " +
      'now read as another type (numeric, binary, categorical), which usually means a recoding or values that no longer read as numbers.',
    params: { type: 'object', properties: {}, additionalProperties: false },
    messages: {
      added: {
        message: 'column {column} is new since the previous delivery',
        fix: 'Ask the sender what {column} holds and add it to the role map if the analysis needs it',
      },
      dropped: {
        message: 'column {column} of the previous delivery is missing from this one',
        fix: 'Ask the sender to deliver {column} again, or to say why it was dropped',
      },
      retyped: {
        message: 'column {column} reads as {now} now, as {before} in the previous delivery',
        fix: 'Ask the sender whether {column} was recoded; values that no longer read as numbers are listed by the audit',
      },
    },
    sources: ['common practice'],
  },
  check({ previous, current }) {
    const before = previous.report.snapshot.columns;
    const now = current.snapshot.columns;
    const out: FindingDraft[] = [];
    for (const column of Object.keys(now)) {
      if (!before[column]) out.push({ messageId: 'added', column, data: { column }, severity: 'note' });
      else if (before[column].type !== now[column].type) {
        out.push({ messageId: 'retyped', column, data: { column, before: before[column].type, now: now[column].type } });
      }
    }
    for (const column of Object.keys(before)) if (!now[column]) out.push({ messageId: 'dropped', column, data: { column } });
    return out;
  },
});
