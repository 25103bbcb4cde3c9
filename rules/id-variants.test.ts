import { describe, expect, it } from 'vitest';
import { normalizeId } from '../src/source/lookups/lookup.js';
import type { Row } from '../test/helpers/delivery.js';
import { auditRows, findingsOf, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';

// records 1–6 "W-014" spelled three ways, 7–9 "007"/"7", 10–13 "12"/"12.0", 14–15 "A7" alone
const spellings = ['W-014', 'W-014', 'W-014', 'W-014 ', 'W-014 ', 'w-014', '007', '007', '7', '12', '12', '12.0', '12.0', 'A7', 'A7'];
const rows: Row[] = spellings.map((g, i) => ({ g, id: `r${i + 1}`, y: i }));

describe('id-variants', () => {
  it('lists each set of group spellings, usual spelling first, and the records of the others', async () => {
    const f = onlyFinding(await auditRows(rows, { group: 'g' }), 'id-variants', 'g');
    expect(f.severity).toBe('blocker');
    expect(f.count).toBe(3);
    expect(f.groups).toEqual(['007', '7', '12', '12.0', 'W-014', 'W-014 ', 'w-014']);
    // the minority spellings: "7" (record 9), "12.0" (12, 13; "12" wins the tie by name), "W-014 " and "w-014" (4–6)
    expect(f.rows).toEqual([4, 5, 6, 9, 12, 13]);
    expectMessage(f, 'groups', { count: 3, column: 'g' });
    expect(f.data.sets).toContain('"W-014" (3) / "W-014 " (2) / "w-014" (1)');
    expect(f.data.sets).toContain('"007" (2) / "7" (1)');
    expect(f.data.sets).toContain('"12" (2) / "12.0" (2)');
  });

  it('lists unit IDs written in more than one way from one bounded aggregate', async () => {
    const units: Row[] = [
      { g: 'A', id: 'u01', y: 1 },
      { g: 'A', id: 'U01', y: 2 },
      { g: 'B', id: 'u01', y: 3 },
      { g: 'B', id: '0042', y: 4 },
      { g: 'B', id: '42', y: 5 },
      { g: 'C', id: 'k9', y: 6 },
    ];
    const f = onlyFinding(await auditRows(units, { group: 'g', unit: 'id' }), 'id-variants', 'id');
    expect(f.count).toBe(2);
    expectMessage(f, 'units', { column: 'id' });
    expect(f.data.sets).toContain('"0042" (1) / "42" (1)');
    expect(f.data.sets).toContain('"u01" (2) / "U01" (1)');
    expect(f.rows).toEqual([2, 5]);
    const off = await auditRows(units, { group: 'g', unit: 'id', rules: { 'id-variants': { units: false } } });
    expect(findingsOf(off, 'id-variants')).toEqual([]);
  });

  it('is silent on distinct IDs; zeros inside an ID and long digit strings are not folded', async () => {
    const clean: Row[] = ['S1', 'S01', 'S10', 'W-1', 'W-01', '1234567890123456', '1234567890123457'].flatMap((g, j) => [
      { g, id: `${j}a`, y: 1 },
      { g, id: `${j}b`, y: 2 },
    ]);
    expect(findingsOf(await auditRows(clean, { group: 'g', unit: 'id' }), 'id-variants')).toEqual([]);
  });

  it('normalizeId: trim, case-fold, leading zeros, numbers as numbers', () => {
    expect(normalizeId(' W-014 ')).toBe(normalizeId('w-014'));
    expect(normalizeId('12')).toBe(normalizeId('12.0'));
    expect(normalizeId('012')).toBe(normalizeId('12'));
    expect(normalizeId('007a')).toBe('7a');
    expect(normalizeId('S01')).not.toBe(normalizeId('S1'));
  });
});
