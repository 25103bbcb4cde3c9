import { describe, expect, it } from 'vitest';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';

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
    expectMessage(f, 'between', { column: 'x', groups: 6 });
  });

  it('says so when the variable is the same everywhere', async () => {
    const f = onlyFinding(
      await auditRows(
        groupedRows(4, 3, () => ({ x: 1 })),
        roles,
      ),
      'level1-constant-within',
    );
    expectMessage(f, 'constant');
  });

  it('is silent when the variable varies within some group, or is seen in too few groups', async () => {
    const varies = groupedRows(6, 4, (j, i) => ({ x: j * 10 + (j === 5 ? i : 0) }));
    expect(findingsOf(await auditRows(varies, roles), 'level1-constant-within')).toEqual([]);
    const few = groupedRows(6, 4, (j) => ({ x: j }));
    expect(
      findingsOf(await auditRows(few, { ...roles, rules: { 'level1-constant-within': { min_groups: 7 } } }), 'level1-constant-within'),
    ).toEqual([]);
  });
});
