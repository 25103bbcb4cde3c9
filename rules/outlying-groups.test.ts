import { beforeAll, describe, expect, it } from 'vitest';
import type { Report } from '../src/report/types.js';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';

/** Records alternate ±1 around their group's mean: σ² ≈ 1 in every group. */
const around = (mean: (j: number) => number, count: number, size: number) =>
  groupedRows(count, size, (j, i) => ({ y: (mean(j) + (i % 2 ? 1 : -1)).toFixed(4) }));

// 30 groups of 10 whose means spread evenly over ±0.9; G005 sits 12 above them
const spread = (j: number) => 0.9 * Math.sin(j * 1.7);
const roles = { group: 'g', outcome: 'y' };

describe('outlying-groups', () => {
  let planted: Report;
  let clean: Report;
  let swayed: Report;
  beforeAll(async () => {
    [planted, clean, swayed] = await Promise.all([
      auditRows(
        around((j) => spread(j) + (j === 4 ? 12 : 0), 30, 10),
        roles,
      ),
      auditRows(around(spread, 30, 10), roles),
      // six groups of 20 close together and one 1.5 above: not beyond ±3, yet it carries the ICC
      auditRows(
        around((j) => [0, 0.1, -0.1, 0.05, -0.05, 0, 1.5][j], 7, 20),
        roles,
      ),
    ]);
  });

  it('a group far from the rest is listed with its size, z and the ICC without it', () => {
    const f = onlyFinding(planted, 'outlying-groups');
    expect(f.severity).toBe('warning');
    expect(f.count).toBe(1);
    expect(f.groups).toEqual(['G005']);
    expectMessage(f, 'outlying', { column: 'y', count: 1, limit: 3 });
    expect(f.data.list).toMatch(/^G005 \(n 10, z \d+\.\d\d, ICC without it 0\.\d{3}\)$/);
    expect(f.rows).toBeUndefined();
  });

  it('no group beyond ±3 and none moving the ICC: nothing', () => {
    expect(clean.outcomes.y.reml.tau2).toBeGreaterThan(0);
    expect(findingsOf(clean, 'outlying-groups')).toEqual([]);
  });

  it('a group that alone moves the ICC: a note naming it', () => {
    const f = onlyFinding(swayed, 'outlying-groups');
    expect(f.severity).toBe('note');
    expect(f.groups).toEqual(['G007']);
    expectMessage(f, 'influential', { column: 'y', limit: 0.05, icc: swayed.outcomes.y.reml.icc.toFixed(3) });
    expect(f.data.list).toMatch(/^G007 \(n 20, z [12]\.\d\d, ICC without it 0\.0\d\d\)$/);
  });
});
