import { describe, expect, it } from 'vitest';
import { auditRows, findingsOf, onlyFinding } from '../test/helpers/delivery.js';
import type { Row } from '../test/helpers/delivery.js';

const base: Row[] = [
  { id: 'a1', g: 'A', y: 1 },
  { id: 'a2', g: 'A', y: 2 },
  { id: 'b1', g: 'B', y: 3 },
  { id: 'b2', g: 'B', y: 4 },
];
const roles = { group: 'g', unit: 'id', outcome: 'y' };

describe('duplicate-unit-id', () => {
  it('tells exact copies (warning) from IDs shared by differing records (blocker)', async () => {
    const rows: Row[] = [...base, { id: 'a1', g: 'A', y: 1 }, { id: 'b2', g: 'B', y: 9 }, { id: 'b2', g: 'A', y: 4 }];
    const found = findingsOf(await auditRows(rows, roles), 'duplicate-unit-id');
    expect(found.map((f) => f.severity)).toEqual(['blocker', 'warning']);
    const [conflicting, copies] = found;
    expect(conflicting.count).toBe(1);
    expect(conflicting.rows).toEqual([4, 6, 7]);
    expect(conflicting.message).toBe('1 id value(s) are on several records that differ (3 records): "b2" (3 records)');
    expect(conflicting.fix).toMatch(/which record is right/);
    expect(copies.count).toBe(1);
    expect(copies.rows).toEqual([1, 5]);
    expect(copies.message).toContain('1 extra record(s), every column equal');
    expect(copies.message).toContain('"a1" (2 records)');
    expect(copies.fix).toMatch(/keep one of each/);
  });

  it('is silent when every unit ID is on one record, or when no unit is declared', async () => {
    expect(findingsOf(await auditRows(base, roles), 'duplicate-unit-id')).toEqual([]);
    const copied = [...base, base[0]];
    expect(findingsOf(await auditRows(copied, { group: 'g' }), 'duplicate-unit-id')).toEqual([]);
  });
});
