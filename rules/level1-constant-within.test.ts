import { describe, expect, it } from 'vitest';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';

const roles = { group: 'g', level1: ['x'] };

describe('level1-constant-within', () => {
  it('flags a level-1 variable with one value per group that differs between groups', async () => {
    const rows = groupedRows(6, 4, (j) => ({ x: j * 10, kind: `k${j}` }));
    const report = await auditRows(rows, { group: 'g', level1: ['x', 'kind'] });
    const found = findingsOf(report, 'level1-constant-within');
    expect(found.map((f) => f.column)).toEqual(['kind', 'x']);
    const f = onlyFinding(report, 'level1-constant-within', 'x');
    expect(f.severity).toBe('warning');
    expect(f.count).toBe(6);
    expect(f.message).toContain('x is declared level-1 but takes one value within each of the 6 groups');
    expect(f.fix).toMatch(/declare it under level2/);
  });

  it('says so when the variable is the same everywhere', async () => {
    const f = onlyFinding(await auditRows(groupedRows(4, 3, () => ({ x: 1 })), roles), 'level1-constant-within');
    expect(f.message).toContain('has the same value on every record');
  });

  it('is silent when the variable varies within some group, or is seen in too few groups', async () => {
    const varies = groupedRows(6, 4, (j, i) => ({ x: j * 10 + (j === 5 ? i : 0) }));
    expect(findingsOf(await auditRows(varies, roles), 'level1-constant-within')).toEqual([]);
    const few = groupedRows(6, 4, (j) => ({ x: j }));
    expect(findingsOf(await auditRows(few, { ...roles, rules: { 'level1-constant-within': { min_groups: 7 } } }), 'level1-constant-within')).toEqual([]);
  });
});
