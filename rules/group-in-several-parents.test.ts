import { describe, expect, it } from 'vitest';
import { auditRows, findingsOf, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';
import { parentRows } from '../test/helpers/parent-rows.js';

const roles = { group: 'g', parent: 'p', level2: ['size'] };

describe('group-in-several-parents', () => {
  it('names a group split across parents whose level-2 values agree', async () => {
    const f = onlyFinding(await auditRows(parentRows, roles), 'group-in-several-parents');
    expect(f.severity).toBe('warning');
    expect(f.count).toBe(1);
    expect(f.groups).toEqual(['A']);
    expect(f.rows).toEqual([1, 2, 3, 4, 5, 6]);
    expectMessage(f, 'split', { group: 'g', parent: 'p', how: 'their level-2 values agree across the p values' });
    expect(f.data.splits).toContain('A: north (5) / south (1)');
  });

  it('without level-2 variables it cannot tell a reused code, and says so', async () => {
    const f = onlyFinding(await auditRows(parentRows, { group: 'g', parent: 'p' }), 'group-in-several-parents');
    expect(f.count).toBe(2);
    expect(f.groups).toEqual(['A', 'B']);
    expectMessage(f, 'split', { how: 'no level-2 variable is declared to tell a split group from a reused code' });
  });

  it('is silent when each group has one parent, or no parent is declared', async () => {
    const clean = parentRows.filter((r) => r.p !== 'south');
    expect(findingsOf(await auditRows(clean, roles), 'group-in-several-parents')).toEqual([]);
    expect(findingsOf(await auditRows(parentRows, { group: 'g', level2: ['size'] }), 'group-in-several-parents')).toEqual([]);
  });
});
