import type { Finding } from './rules/types.js';
import type { FailOn } from './severity.js';
import { failsGate } from './severity.js';

export type { FailOn };

export type Verdict = 'ready' | 'caveats' | 'not-ready';
export type Grade = 'A' | 'B' | 'C' | 'D' | 'F';

/** Points a finding of each severity costs (README, "Grading"). */
export const PENALTY = { blocker: 25, warning: 8, note: 2 } as const;

/** Notes together cost at most this much: they are worth knowing, never a reason to fail a grade. */
export const NOTES_CAP = 10;

/** Lowest score for each grade, best first. */
export const GRADE_FLOORS: [Grade, number][] = [
  ['A', 90],
  ['B', 80],
  ['C', 65],
  ['D', 50],
  ['F', 0],
];

export interface Graded {
  score: number;
  grade: Grade;
  verdict: Verdict;
}

/**
 * Score = max(0, 100 − 25·blockers − 8·warnings − min(10, 2·notes)); grade by the floors above, but any
 * blocker makes it F; verdict not-ready with a blocker, caveats with a warning, else ready.
 */
export function grade(findings: readonly Finding[]): Graded {
  const count = (s: Finding['severity']) => findings.filter((f) => f.severity === s).length;
  const blockers = count('blocker');
  const warnings = count('warning');
  const notes = count('note');
  const score = Math.max(0, 100 - PENALTY.blocker * blockers - PENALTY.warning * warnings - Math.min(NOTES_CAP, PENALTY.note * notes));
  const byScore = GRADE_FLOORS.find(([, floor]) => score >= floor)?.[0] ?? 'F';
  const g: Grade = blockers > 0 ? 'F' : byScore;
  const verdict: Verdict = blockers > 0 ? 'not-ready' : warnings > 0 ? 'caveats' : 'ready';
  return { score, grade: g, verdict };
}

/** Exit code of the gate: 1 when a finding at or above `failOn` exists, else 0. */
export function exitCode(findings: readonly Finding[], failOn: FailOn): 0 | 1 {
  return findings.some((f) => failsGate(f.severity, failOn)) ? 1 : 0;
}
