import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import { describe, expect, it } from 'vitest';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';

describe('missing-by-group', () => {
  it('tests equal missing rates across groups and names the worst groups', async () => {
    // 20 groups of 20; x missing on 1 record in every group except G001 (12 missing) and G002 (10 missing)
    const rows = groupedRows(20, 20, (j, i) => ({ x: i < (j === 0 ? 12 : j === 1 ? 10 : 1) ? null : i }));
    const f = onlyFinding(await auditRows(rows, { group: 'g', level1: ['x'] }), 'missing-by-group', 'x');
    expect(f.severity).toBe('warning');
    // by hand: 40 missing of 400 (p̂ = .1); X² = Σ (O − E)²/E over the 2 × 20 table
    const share = 40 / 400;
    const missing = [12, 10, ...Array(18).fill(1)];
    const x2 = missing.reduce(
      (s, m) => s + (m - 20 * share) ** 2 / (20 * share) + (20 - m - 20 * (1 - share)) ** 2 / (20 * (1 - share)),
      0,
    );
    expectMessage(f, 'uneven', { column: 'x', chi2: x2.toFixed(1), df: 19 });
    // p from the kept library @stdlib/stats-base-dists-chisquare-cdf (well below the .01 default)
    expect(1 - chisquareCdf(x2, 19)).toBeLessThan(0.001);
    expect(f.data).toMatchObject({ p: 'p < .001', missing: 40, records: 400, share: '10.0%' });
    // the relation is said once: "p < .001", never "p = < .001"
    expect(f.message).toContain('19 df, p < .001;');
    expect(f.data.worst).toMatch(/^G001 \(12 of 20\), G002 \(10 of 20\)/);
    expect(f.groups).toEqual(['G001', 'G002']);
  });

  it('names groups where a variable is missing on every record', async () => {
    const rows = groupedRows(6, 3, (j, i) => ({ y: i, staff: j === 2 || j === 4 ? null : 5 }));
    const f = onlyFinding(await auditRows(rows, { group: 'g', outcome: 'y', level2: ['staff'] }), 'missing-by-group', 'staff');
    expect(f.count).toBe(2);
    expect(f.groups).toEqual(['G003', 'G005']);
    expectMessage(f, 'allMissing', { column: 'staff', count: 2, records: 6, ids: 'G003, G005' });
  });

  it('is silent when missingness is even across groups, or absent', async () => {
    const even = groupedRows(20, 10, (_, i) => ({ x: i === 0 ? null : i }));
    expect(findingsOf(await auditRows(even, { group: 'g', level1: ['x'] }), 'missing-by-group')).toEqual([]);
    const none = groupedRows(5, 3, (_, i) => ({ x: i }));
    expect(findingsOf(await auditRows(none, { group: 'g', level1: ['x'] }), 'missing-by-group')).toEqual([]);
  });
});
