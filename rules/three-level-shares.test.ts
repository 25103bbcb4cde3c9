import { beforeAll, describe, expect, it } from 'vitest';
import type { Report } from '../src/report/types.js';
import type { Row } from '../test/helpers/delivery.js';
import { auditRows, findingsOf, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';
import { mulberry32 } from '../test/helpers/prng.js';

/**
 * 8 parents × 5 groups × `size` records, y = parentSd·v_k + groupSd·u_jk + e (standard normal
 * draws, fixed seed): the planted three-level structure.
 */
function nested(parentSd: number, groupSd: number, size: number, seed: number): Row[] {
  const random = mulberry32(seed);
  const normal = () => Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
  const rows: Row[] = [];
  for (let k = 0; k < 8; k++) {
    const v = parentSd * normal();
    for (let j = 0; j < 5; j++) {
      const u = groupSd * normal();
      for (let i = 0; i < size; i++) rows.push({ g: `G${k}${j}`, p: `P${k}`, y: (v + u + normal()).toFixed(4) });
    }
  }
  return rows;
}

const roles = { group: 'g', parent: 'p', outcome: 'y' };

describe('three-level-shares', () => {
  let planted: Report;
  let clean: Report;
  let modest: Report;
  beforeAll(async () => {
    // one group written under two parents: left out of the fit (group-in-several-parents names it)
    const split = [...[1, 2, 3].map((i) => ({ g: 'GX', p: 'P0', y: i })), { g: 'GX', p: 'P1', y: 4 }];
    [planted, clean, modest] = await Promise.all([
      auditRows([...nested(3, 1, 12, 7), ...split], roles),
      auditRows(nested(0, 1, 12, 7), roles),
      auditRows(nested(0.2, 0.05, 60, 11), roles),
    ]);
  });

  it('a parent level with a real share: warning with the three-level shares and the two-level group variance', () => {
    const t = planted.outcomes.y.threeLevel!;
    expect([t.parents, t.groups, t.n, t.excludedGroups]).toEqual([8, 40, 480, 1]);
    expect(t.reml.shares.parent).toBeGreaterThan(0.5);
    // the two-level fit gives the parent's variance to the groups
    expect(t.groupsOnly.tau2).toBeGreaterThan(t.reml.tau2Group + 0.5 * t.reml.tau2Parent);
    const f = onlyFinding(planted, 'three-level-shares');
    expect(f.severity).toBe('warning');
    expect(f.column).toBe('y');
    expectMessage(f, 'parentShare', {
      column: 'y',
      parent: 'p',
      group: 'g',
      groups: 40,
      parents: 8,
      excluded: 1,
      p: 'p < .001',
      tauParent: t.reml.tau2Parent.toFixed(4),
      tauTwoLevel: t.groupsOnly.tau2.toFixed(4),
    });
    expect(f.rows).toBeUndefined();
  });

  it('a small parent share that still changes the group variance: groupOverstated', () => {
    const t = modest.outcomes.y.threeLevel!;
    expect(t.reml.shares.parent).toBeLessThan(0.05);
    expect(t.parentTest.p).toBeLessThan(0.05);
    const f = onlyFinding(modest, 'three-level-shares');
    expectMessage(f, 'groupOverstated', { column: 'y', excluded: 0, tauGroup: t.reml.tau2Group.toFixed(4) });
  });

  it('no parent variance: nothing, and the fit is still in the report', () => {
    const t = clean.outcomes.y.threeLevel!;
    expect(t.parentTest.p).toBeGreaterThan(0.05);
    expect(findingsOf(clean, 'three-level-shares')).toEqual([]);
  });

  it('no parent declared: no fit and no finding', async () => {
    const report = await auditRows(nested(3, 1, 4, 7), { group: 'g', outcome: 'y' });
    expect(report.outcomes.y.threeLevel).toBeUndefined();
    expect(findingsOf(report, 'three-level-shares')).toEqual([]);
  });
});
