import { describe, expect, it } from 'vitest';
import { exitCode, GRADE_FLOORS, grade, NOTES_CAP, PENALTY } from '../src/grade.js';
import type { Severity } from '../src/roles/types.js';
import type { Finding } from '../src/rules/types.js';

function findings(blockers: number, warnings: number, notes: number): Finding[] {
  const make = (severity: Severity, i: number): Finding => ({ rule: `r${i}`, severity, messageId: 'm', data: {}, message: 'm', fix: 'f' });
  return [
    ...Array.from({ length: blockers }, (_, i) => make('blocker', i)),
    ...Array.from({ length: warnings }, (_, i) => make('warning', i)),
    ...Array.from({ length: notes }, (_, i) => make('note', i)),
  ];
}

describe('grade', () => {
  it('uses the documented penalties and floors', () => {
    expect(PENALTY).toEqual({ blocker: 25, warning: 8, note: 2 });
    expect(NOTES_CAP).toBe(10);
    expect(GRADE_FLOORS).toEqual([
      ['A', 90],
      ['B', 80],
      ['C', 65],
      ['D', 50],
      ['F', 0],
    ]);
  });

  it('no findings: 100, A, ready', () => {
    expect(grade([])).toEqual({ score: 100, grade: 'A', verdict: 'ready' });
  });

  it.each([
    // blockers, warnings, notes → score, grade, verdict
    [0, 0, 1, 98, 'A', 'ready'],
    [0, 0, 5, 90, 'A', 'ready'], // 90 is the A floor
    [0, 0, 6, 90, 'A', 'ready'], // notes cost at most 10 in all
    [0, 0, 40, 90, 'A', 'ready'], // however many: notes alone never lower the grade below A
    [0, 1, 1, 90, 'A', 'caveats'],
    [0, 1, 6, 82, 'B', 'caveats'],
    [0, 2, 0, 84, 'B', 'caveats'],
    [0, 3, 0, 76, 'C', 'caveats'],
    [0, 3, 9, 66, 'C', 'caveats'], // just above the C floor 65
    [0, 4, 0, 68, 'C', 'caveats'],
    [0, 4, 5, 58, 'D', 'caveats'],
    [0, 5, 5, 50, 'D', 'caveats'], // 50 is the D floor
    [0, 6, 0, 52, 'D', 'caveats'],
    [0, 6, 1, 50, 'D', 'caveats'],
    [0, 6, 2, 48, 'F', 'caveats'], // F by score alone, no blocker: still "caveats"
    [0, 13, 0, 0, 'F', 'caveats'], // 100 − 104 clamps to 0
    [1, 0, 0, 75, 'F', 'not-ready'], // any blocker is F whatever the score
    [1, 3, 2, 47, 'F', 'not-ready'],
    [3, 0, 0, 25, 'F', 'not-ready'],
    [4, 0, 0, 0, 'F', 'not-ready'],
    [5, 2, 1, 0, 'F', 'not-ready'], // never below 0
  ] as const)('%i blockers, %i warnings, %i notes → %i %s %s', (b, w, n, score, g, verdict) => {
    expect(grade(findings(b, w, n))).toEqual({ score, grade: g, verdict });
  });

  it('score is max(0, 100 − 25b − 8w − min(10, 2n)) for every small mix', () => {
    for (let b = 0; b <= 4; b++)
      for (let w = 0; w <= 13; w++)
        for (let n = 0; n <= 51; n += 3) {
          const r = grade(findings(b, w, n));
          expect(r.score).toBe(Math.max(0, 100 - 25 * b - 8 * w - Math.min(10, 2 * n)));
          const byScore = GRADE_FLOORS.find(([, floor]) => r.score >= floor)![0];
          expect(r.grade).toBe(b > 0 ? 'F' : byScore);
          expect(r.verdict).toBe(b > 0 ? 'not-ready' : w > 0 ? 'caveats' : 'ready');
        }
  });

  it('does not depend on the order of the findings', () => {
    const list = findings(1, 2, 3);
    expect(grade([...list].reverse())).toEqual(grade(list));
  });
});

describe('exitCode', () => {
  it.each([
    // findings, fail-on → exit
    [[0, 0, 0], 'blocker', 0],
    [[0, 0, 0], 'warning', 0],
    [[0, 0, 0], 'never', 0],
    [[0, 0, 9], 'blocker', 0],
    [[0, 0, 9], 'warning', 0], // notes never fail the gate
    [[0, 0, 9], 'never', 0],
    [[0, 1, 0], 'blocker', 0],
    [[0, 1, 0], 'warning', 1],
    [[0, 1, 0], 'never', 0],
    [[1, 0, 0], 'blocker', 1],
    [[1, 0, 0], 'warning', 1], // warning means "warning or worse"
    [[1, 0, 0], 'never', 0],
    [[2, 3, 4], 'blocker', 1],
    [[2, 3, 4], 'never', 0],
  ] as const)('%j with --fail-on %s → %i', ([b, w, n], failOn, code) => {
    expect(exitCode(findings(b, w, n), failOn)).toBe(code);
  });
});
