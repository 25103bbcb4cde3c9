import type { Verdict } from '../grade.js';
import type { Severity } from '../roles/types.js';

/** Severities in report order. */
export const SEVERITIES: readonly Severity[] = ['blocker', 'warning', 'note'];

/** Section heading per severity (plural). */
export const HEADINGS: Record<Severity, string> = { blocker: 'Blockers', warning: 'Warnings', note: 'Notes' };

/** Plain-text mark per severity, so that severity never rests on colour alone. */
export const MARKS: Record<Severity, string> = { blocker: '[X]', warning: '[!]', note: '[i]' };

export const VERDICT_TEXT: Record<Verdict, string> = {
  ready: 'READY',
  caveats: 'READY WITH CAVEATS',
  'not-ready': 'NOT READY',
};

/** The closing caveat every human-readable report carries. */
export const THRESHOLD_CAVEAT =
  'Thresholds are published rules of thumb, not law: where the study analysis plan or the data ' +
  "owner's rules say otherwise, they take precedence.";
