import type { Verdict } from '../grade.js';
import { NOTES_CAP, PENALTY } from '../grade.js';
import type { Finding } from '../rules/types.js';
import { countOf, SEVERITIES, SEVERITY_ACTION } from '../severity.js';
import type { Report } from './types.js';

/** The verdict as the start of a sentence about the delivery. */
export const VERDICT_HEADLINE: Record<Verdict, string> = {
  ready: 'Ready for a multilevel model',
  caveats: 'Ready for a multilevel model, with caveats',
  'not-ready': 'Not ready for a multilevel model',
};

/** What to do next, by verdict. */
export const VERDICT_ADVICE: Record<Verdict, string> = {
  'not-ready': 'Send the blockers back to the sender before any modelling.',
  caveats: 'Usable, but settle the warnings with the analyst before modelling.',
  ready: 'No blocker or warning: the delivery can go on to modelling.',
};

/** "4 blockers to send back, 2 warnings to settle": each severity found, with what to do with it. */
export function tally(findings: readonly Finding[]): string {
  const parts = SEVERITIES.flatMap((s) => {
    const n = findings.filter((f) => f.severity === s).length;
    return n ? [`${countOf(s, n)} ${SEVERITY_ACTION[s].tally}`] : [];
  });
  return parts.length ? parts.join(', ') : 'nothing to send back or settle';
}

/** The verdict as one plain sentence: "Not ready for a multilevel model: 3 blockers to send back." */
export function verdictSentence(report: Report): string {
  return `${VERDICT_HEADLINE[report.verdict]}: ${tally(report.findings)}.`;
}

/** How the score is reached, so that the number explains itself (README, "Grading"). */
export const SCORE_RULE =
  `100 less ${PENALTY.blocker} a blocker, ${PENALTY.warning} a warning, ${PENALTY.note} a note ` +
  `and at most ${NOTES_CAP} for all notes; any blocker makes the grade F`;

/** Grade and score as secondary text: "grade F, score 0 of 100". */
export function gradeLine(report: Report): string {
  return `grade ${report.grade}, score ${report.score} of 100`;
}

/** The closing caveat every human-readable report carries. */
export const THRESHOLD_CAVEAT =
  'Thresholds are published rules of thumb, not law: where the study analysis plan or the data ' +
  "owner's rules say otherwise, they take precedence.";
