import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import { describe, expect, it } from 'vitest';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';

describe('missing-by-group', () => {
  it('tests equal missing rates across groups and names the worst groups', async () => {
    // 20 groups of 20; x missing on 1 record in every group except G001 (12 missing) and G002 (10 missing)
    const rows = groupedRows(20, 20, (j, i) => ({ x: i < (j === 0 ? 12 : j === 1 ? 10 : 1) ? null : i }));
    const f = onlyFinding(await auditRows(rows, { group: 'g', level1: ['x'] }), 'missing-by-group', 'x');
    expect(f.severity).toBe('warning');
    // by hand: 40 missing of 400 (p̂ = .1); X² = Σ (O − E)²/E over the 2 × 20 table
    const share = 40 / 400;
    const missing = [12, 10, ...Array(18).fill(1)];
    const x2 = missing.reduce((s, m) => s + (m - 20 * share) ** 2 / (20 * share) + (20 - m - 20 * (1 - share)) ** 2 / (20 * (1 - share)), 0);
    expect(f.message).toContain(`X² = ${x2.toFixed(1)} on 19 df`);
    // p from the kept library @stdlib/stats-base-dists-chisquare-cdf (well below the .01 default)
    expect(1 - chisquareCdf(x2, 19)).toBeLessThan(0.001);
    expect(f.message).toContain('p = < .001');
    expect(f.message).toContain('40 of 400 values missing (10.0%)');
    expect(f.message).toContain('highest in G001 (12 of 20), G002 (10 of 20)');
    expect(f.groups).toEqual(['G001', 'G002']);
    expect(f.fix).toMatch(/impute with a model that includes the groups/);
  });

  it('names groups where a variable is missing on every record', async () => {
    const rows = groupedRows(6, 3, (j, i) => ({ y: i, staff: j === 2 || j === 4 ? null : 5 }));
    const f = onlyFinding(await auditRows(rows, { group: 'g', outcome: 'y', level2: ['staff'] }), 'missing-by-group', 'staff');
    expect(f.count).toBe(2);
    expect(f.groups).toEqual(['G003', 'G005']);
    expect(f.message).toBe('staff is missing on every record of 2 group(s) (6 records): G003, G005');
    expect(f.fix).toMatch(/drops these groups entirely/);
  });

  it('is silent when missingness is even across groups, or absent', async () => {
    const even = groupedRows(20, 10, (_, i) => ({ x: i === 0 ? null : i }));
    expect(findingsOf(await auditRows(even, { group: 'g', level1: ['x'] }), 'missing-by-group')).toEqual([]);
    const none = groupedRows(5, 3, (_, i) => ({ x: i }));
    expect(findingsOf(await auditRows(none, { group: 'g', level1: ['x'] }), 'missing-by-group')).toEqual([]);
  });
});
