import { describe, expect, it } from 'vitest';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';

// 10 groups of 5 with unique unit IDs g-i
const clean = groupedRows(10, 5, (j, i) => ({ id: `u${j}-${i}`, y: i }));
const roles = { group: 'g', unit: 'id' };

describe('unit-in-several-groups', () => {
  it('names the units found in more than one group and says a strictly nested model does not fit', async () => {
    const rows = [...clean, { g: 'G002', id: 'u0-0', y: 9 }];
    const f = onlyFinding(await auditRows(rows, roles), 'unit-in-several-groups');
    expect(f.severity).toBe('warning'); // 2 of 51 records (3.9%) < 5%
    expect(f.count).toBe(1);
    expect(f.groups).toEqual(['G001', 'G002']);
    expect(f.rows).toEqual([1, 51]);
    expectMessage(f, 'mobile', { count: 1, ids: '"u0-0" in G001, G002' });
  });

  it('blocks at block_share of the records', async () => {
    const rows = [...clean, { g: 'G002', id: 'u0-0', y: 9 }];
    const f = onlyFinding(
      await auditRows(rows, { ...roles, rules: { 'unit-in-several-groups': { block_share: 0.02 } } }),
      'unit-in-several-groups',
    );
    expect(f.severity).toBe('blocker');
  });

  it('is silent when each unit is in one group (repeats within a group are duplicate-unit-id)', async () => {
    expect(findingsOf(await auditRows(clean, roles), 'unit-in-several-groups')).toEqual([]);
    const repeatedInGroup = [...clean, { g: 'G001', id: 'u0-0', y: 7 }];
    expect(findingsOf(await auditRows(repeatedInGroup, roles), 'unit-in-several-groups')).toEqual([]);
  });
});
