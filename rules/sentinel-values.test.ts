import { describe, expect, it } from 'vitest';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';

// 5 groups of 10 outcomes between 10 and 60; records 4, 17, 33 are -999
const CODED = new Set([4, 17, 33]);
const rows = groupedRows(5, 10, (j, i) => ({ y: CODED.has(j * 10 + i + 1) ? -999 : 10 + j * 10 + i }));

describe('sentinel-values', () => {
  it('flags a code far outside the other values, with its records, and asks to declare it missing', async () => {
    const f = onlyFinding(await auditRows(rows, { group: 'g', outcome: 'y' }), 'sentinel-values');
    expect(f.severity).toBe('warning');
    expect(f.column).toBe('y');
    expect(f.count).toBe(3);
    expect(f.rows).toEqual([4, 17, 33]);
    expect(f.values).toEqual(['-999 ×3 (other values 10 to 59)']);
    expectMessage(f, 'codes', { column: 'y', codes: '-999', tokens: '"-999"', count: 3 });
  });

  it('is silent for a code inside the range of the other values, a single occurrence, or a declared code', async () => {
    const inRange = groupedRows(5, 30, (j, i) => ({ y: i === 0 ? 99 : (i * 7 + j) % 120 }));
    expect(findingsOf(await auditRows(inRange, { group: 'g', outcome: 'y' }), 'sentinel-values')).toEqual([]);
    const once = rows.map((r, k) => (k === 16 || k === 32 ? { ...r, y: 20 } : r));
    expect(findingsOf(await auditRows(once, { group: 'g', outcome: 'y' }), 'sentinel-values')).toEqual([]);
    expect(
      findingsOf(await auditRows(once, { group: 'g', outcome: 'y', rules: { 'sentinel-values': { min_count: 1 } } }), 'sentinel-values'),
    ).toHaveLength(1);
    expect(findingsOf(await auditRows(rows, { group: 'g', outcome: 'y', missing: ['', '-999'] }), 'sentinel-values')).toEqual([]);
  });

  it('codes come from the role map', async () => {
    const eights = rows.map((r) => (r.y === -999 ? { ...r, y: -888 } : r));
    expect(findingsOf(await auditRows(eights, { group: 'g', outcome: 'y' }), 'sentinel-values')).toEqual([]);
    const f = onlyFinding(
      await auditRows(eights, { group: 'g', outcome: 'y', rules: { 'sentinel-values': { codes: [-888] } } }),
      'sentinel-values',
    );
    expect(f.count).toBe(3);
  });
});
