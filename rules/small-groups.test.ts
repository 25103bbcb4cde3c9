import { describe, expect, it } from 'vitest';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';

// 10 groups of 2 and 10 of 20: half of the groups are small
const mixed = groupedRows(20, (j) => (j < 10 ? 2 : 20), (j, i) => ({ y: j + i }));

describe('small-groups', () => {
  it('reports the share of groups below the size and the size distribution', async () => {
    const f = onlyFinding(await auditRows(mixed, { group: 'g' }), 'small-groups');
    expect(f.severity).toBe('note');
    expect(f.count).toBe(10);
    expect(f.groups).toHaveLength(10);
    expect(f.groups?.[0]).toBe('G001');
    expect(f.message).toBe('10 of 20 groups (50.0%) have fewer than 5 records; group sizes: 2: 10, 10–29: 10');
    expect(f.fix).toMatch(/whether the small groups are complete/);
  });

  it('size and shares come from the role map; a warning above warn_share', async () => {
    const rules = { 'small-groups': { size_below: 25, warn_share: 0.9 } };
    const all = onlyFinding(await auditRows(mixed, { group: 'g', rules }), 'small-groups');
    expect(all).toMatchObject({ severity: 'warning', count: 20 });
    const few = await auditRows(mixed, { group: 'g', rules: { 'small-groups': { note_share: 0.6 } } });
    expect(findingsOf(few, 'small-groups')).toEqual([]);
  });

  it('is silent when groups are large enough', async () => {
    expect(findingsOf(await auditRows(groupedRows(10, 6), { group: 'g' }), 'small-groups')).toEqual([]);
  });
});
