import { expect } from 'vitest';
import type { Report } from '../../../src/report/types.js';

/** Numbers equal to ~1e-9 relative (engines sum in different orders); everything else exactly. */
function close(a: unknown, b: unknown, path: string): void {
  if (typeof a === 'number' && typeof b === 'number') {
    const ok = a === b || Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));
    if (!ok) expect.fail(`${path}: ${a} vs ${b}`);
    return;
  }
  if (Array.isArray(a) && Array.isArray(b)) {
    expect(a.length, `${path}.length`).toBe(b.length);
    for (const [i, x] of a.entries()) close(x, b[i], `${path}[${i}]`);
    return;
  }
  if (a && b && typeof a === 'object' && typeof b === 'object') {
    expect(Object.keys(a).sort(), `${path} keys`).toEqual(Object.keys(b).sort());
    for (const k of Object.keys(a)) close((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k], `${path}.${k}`);
    return;
  }
  expect(a, path).toEqual(b);
}

/** The same audit of the same data read from another format or engine: findings, groups, outcome statistics. */
export function expectSameAudit(got: Report, want: Report): void {
  expect(got.findings).toEqual(want.findings);
  expect(got.groups).toEqual(want.groups);
  close(got.outcomes, want.outcomes, 'outcomes');
  expect(got.input.rows).toBe(want.input.rows);
  expect(got.input.rowsRejected).toBe(want.input.rowsRejected);
  expect(got.input.columns).toEqual(want.input.columns);
  expect({ score: got.score, grade: got.grade, verdict: got.verdict }).toEqual({
    score: want.score,
    grade: want.grade,
    verdict: want.verdict,
  });
}
