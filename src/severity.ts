import type { Severity } from './roles/types.js';

export type { Severity };

/** Severities, most severe first: the order of the report, of the findings and of the gate. */
export const SEVERITIES: readonly Severity[] = ['blocker', 'warning', 'note'];

/** Position in SEVERITIES: findings sort by it, and the gate compares with it. */
export const SEVERITY_ORDER: Record<Severity, number> = { blocker: 0, warning: 1, note: 2 };

/** How severe a finding must be to fail the gate (`--fail-on`); `never` fails none. */
export type FailOn = 'blocker' | 'warning' | 'never';

/** Whether a finding of `severity` fails a gate set at `failOn`. */
export function failsGate(severity: Severity, failOn: FailOn): boolean {
  return failOn !== 'never' && SEVERITY_ORDER[severity] <= SEVERITY_ORDER[failOn];
}

/** The word for one finding of a severity, and for several. */
export const SEVERITY_WORD: Record<Severity, { one: string; many: string }> = {
  blocker: { one: 'blocker', many: 'blockers' },
  warning: { one: 'warning', many: 'warnings' },
  note: { one: 'note', many: 'notes' },
};

/** "1 blocker", "3 warnings", "no note". */
export function countOf(severity: Severity, n: number): string {
  const w = SEVERITY_WORD[severity];
  return n === 0 ? `no ${w.one}` : `${n} ${n === 1 ? w.one : w.many}`;
}

/**
 * What the data manager does with a finding of each severity: the section headings and the
 * verdict sentence say it in these words, so a reader learns the step, not only a rank.
 */
export const SEVERITY_ACTION: Record<Severity, { heading: string; tally: string }> = {
  blocker: { heading: 'Blockers: send back to the sender', tally: 'to send back' },
  warning: { heading: 'Warnings: settle with the analyst', tally: 'to settle' },
  note: { heading: 'Notes: for the record', tally: 'for the record' },
};

/**
 * A shape per severity, heaviest for the most severe, shown beside the word (never instead of
 * it) so that severity rests on neither colour nor shape alone.
 */
export const SEVERITY_SHAPE: Record<Severity, string> = { blocker: '■', warning: '◆', note: '○' };
