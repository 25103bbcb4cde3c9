import { beforeAll, describe, expect, it } from 'vitest';
import type { Report } from '../../src/report/types.js';
import { auditRows, findingsOf, groupedRows } from '../helpers/delivery.js';
import { mulberry32, normalGenerator } from '../stats/helpers.js';

const RULES = ['slope-support', 'intercept-variance-at-zero', 'within-between-gap', 'level1-variance-heterogeneity', 'level2-collinearity'];

/**
 * 40 groups of 15: y has a clear group effect, one slope of 1 on x within and between groups, and
 * random slopes on z and w;
 * a and b are unrelated group-level variables. `planted` adds one defect per rule of this issue
 * room: a planned slope w with no spread within any group, the group mean of x with its own
 * effect (a within/between gap), a tenfold level-1 spread in half the groups, and a level-2 c
 * that is a plus a little noise.
 */
function delivery(planted: boolean, seed: number) {
  const normal = normalGenerator(mulberry32(seed));
  const u = Array.from({ length: 40 }, () => 2 * normal());
  // slopes ±1.2 about their mean: a clear slope variance that leaves every group's spread the same
  const slope = Array.from({ length: 40 }, (_, j) => (j % 2 ? 1.2 : -1.2));
  const slopeW = Array.from({ length: 40 }, (_, j) => (j % 4 < 2 ? 1.2 : -1.2));
  const xMean = Array.from({ length: 40 }, () => normal());
  const a = Array.from({ length: 40 }, () => normal());
  const b = Array.from({ length: 40 }, () => normal());
  return groupedRows(40, 15, (j) => {
    const x = xMean[j] + normal();
    const z = normal();
    const spread = planted && j % 2 ? 10 : 1;
    const w = planted ? j % 3 : normal();
    const y = u[j] + x + (planted ? 4 * xMean[j] : 0) + slope[j] * z + (planted ? 0 : slopeW[j] * w) + spread * normal();
    return { y, x, z, w, a: a[j], b: b[j], c: planted ? a[j] + 0.05 * normal() : normal() };
  });
}

const roles = { group: 'g', outcome: 'y', level1: ['x', 'z', 'w'], level2: ['a', 'b', 'c'], slopes: ['z', 'w'] };
const rulesOf = (report: Report) => report.findings.filter((f) => RULES.includes(f.rule)).map((f) => `${f.rule} ${f.column}`);

describe('model-readiness rules on planted structure', () => {
  let clean: Report;
  let planted: Report;
  beforeAll(async () => {
    // the clean case's groups are clearly distinct, slopes vary and predictors are independent
    [clean, planted] = await Promise.all([auditRows(delivery(false, 3), roles), auditRows(delivery(true, 3), roles)]);
  });

  it('a clean delivery yields none of their findings', () => {
    expect(rulesOf(clean)).toEqual([]);
  });

  it('each planted defect is found', () => {
    const found = rulesOf(planted);
    expect(found).toContain('slope-support w');
    expect(findingsOf(planted, 'slope-support').find((f) => f.column === 'w')?.messageId).toBe('noSupport');
    expect(found).toContain('within-between-gap x');
    expect(found).toContain('level1-variance-heterogeneity y');
    expect(found).toContain('level2-collinearity a');
    expect(found).toContain('level2-collinearity c');
    expect(found).not.toContain('intercept-variance-at-zero y');
  });
});
