import { describe, expect, it } from 'vitest';
import type { Row } from '../test/helpers/delivery.js';
import { auditRows, findingsOf } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';

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
    expectMessage(conflicting, 'conflicting', { count: 1, column: 'id', records: 3, ids: '"b2" (3 records)' });
    expect(copies.count).toBe(1);
    expect(copies.rows).toEqual([1, 5]);
    expectMessage(copies, 'copies', { count: 1, column: 'id', copies: 1, ids: '"a1" (2 records)' });
  });

  it('is silent when every unit ID is on one record, or when no unit is declared', async () => {
    expect(findingsOf(await auditRows(base, roles), 'duplicate-unit-id')).toEqual([]);
    const copied = [...base, base[0]];
    expect(findingsOf(await auditRows(copied, { group: 'g' }), 'duplicate-unit-id')).toEqual([]);
  });
});
