import { findingKey } from '../src/compare/finding-key.js';
import { defineChange } from '../src/compare/types.js';
import type { Finding, FindingDraft } from '../src/rules/types.js';

/** Audit findings that are new since the previous delivery's audit, and those resolved. */
export default defineChange({
  meta: {
    id: 'audit-findings-changed',
    title: 'Audit findings new or resolved',
    level: 'data',
    defaultSeverity: 'warning',
    description:
      "The audit's findings against the previous delivery's, matched by rule, message and column: a finding the previous audit did " +
      'not have is new (a warning: something broke), one it had that is gone is resolved (a note). Findings in both persist; the ' +
      "report's changes section counts them.",
    params: { type: 'object', properties: {}, additionalProperties: false },
    messages: {
      new: {
        message: 'new since the previous delivery: {finding}',
        fix: 'Follow the fix of the audit finding it names; it was not there in the previous delivery',
      },
      resolved: {
        message: 'resolved since the previous delivery: {finding}',
        fix: 'Nothing to ask: the previous delivery had this finding and this one does not',
      },
    },
    sources: ['common practice'],
  },
  check({ previous, current }) {
    const own = (fs: readonly Finding[]) => fs.filter((f) => !f.change);
    const before = new Map(own(previous.report.findings).map((f) => [findingKey(f), f]));
    const now = new Map(own(current.findings).map((f) => [findingKey(f), f]));
    const name = (f: Finding) => `${f.rule} (${f.messageId}${f.column !== undefined ? `, ${f.column}` : ''})`;
    const out: FindingDraft[] = [];
    for (const [key, f] of now) {
      if (!before.has(key)) out.push({ messageId: 'new', data: { finding: name(f) }, ...(f.column !== undefined && { column: f.column }) });
    }
    for (const [key, f] of before) {
      if (!now.has(key)) {
        out.push({
          messageId: 'resolved',
          severity: 'note',
          data: { finding: name(f) },
          ...(f.column !== undefined && { column: f.column }),
        });
      }
    }
    return out;
  },
});
