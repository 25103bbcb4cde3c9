import { describe, expect, it } from 'vitest';
import type { Row } from '../test/helpers/delivery.js';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';

const roles = { group: 'g', level2: ['format'] };

// records 1–3 group A (constant), 4–6 group B (record 5 differs), 7–9 group C (record 7 differs)
const varying: Row[] = [
  { g: 'A', format: 'weekly' },
  { g: 'A', format: 'weekly' },
  { g: 'A', format: 'weekly' },
  { g: 'B', format: 'weekly' },
  { g: 'B', format: 'monthly' },
  { g: 'B', format: 'weekly' },
  { g: 'C', format: 'pop-up' },
  { g: 'C', format: 'monthly' },
  { g: 'C', format: 'monthly' },
];

describe('level2-varies', () => {
  it("names the groups, the records that differ from the group's usual value, and the values", async () => {
    const f = onlyFinding(await auditRows(varying, roles), 'level2-varies');
    expect(f.severity).toBe('blocker');
    expect(f.column).toBe('format');
    expect(f.count).toBe(2);
    expect(f.groups).toEqual(['B', 'C']);
    expect(f.rows).toEqual([5, 7]);
    expect(f.values).toEqual(['B: weekly ×2 / monthly ×1', 'C: monthly ×2 / pop-up ×1']);
    expectMessage(f, 'varies', { column: 'format', count: 2 });
    // {values} is filled from the values, in order
    expect(f.message).toContain('B: weekly ×2 / monthly ×1, C: monthly ×2 / pop-up ×1');
  });

  it('is silent when every group has one value', async () => {
    const rows = varying.map((r) => ({ ...r, format: r.g === 'A' ? 'weekly' : 'monthly' }));
    expect(findingsOf(await auditRows(rows, roles), 'level2-varies')).toEqual([]);
  });

  it('a missing value is not a second value', async () => {
    const rows: Row[] = [
      { g: 'A', format: 'weekly' },
      { g: 'A', format: '' },
      { g: 'A', format: 'NA' },
      { g: 'B', format: 'monthly' },
      { g: 'B', format: null },
    ];
    expect(findingsOf(await auditRows(rows, roles), 'level2-varies')).toEqual([]);
  });

  it('only checks the columns declared level-2, one finding per column in column order', async () => {
    const rows: Row[] = [
      { g: 'A', staff: 3, format: 'weekly', note: 'x' },
      { g: 'A', staff: 4, format: 'monthly', note: 'y' },
      { g: 'B', staff: 5, format: 'weekly', note: 'z' },
      { g: 'B', staff: 5, format: 'weekly', note: 'w' },
    ];
    const report = await auditRows(rows, { group: 'g', level2: ['staff', 'format'] });
    const found = findingsOf(report, 'level2-varies');
    expect(found.map((f) => f.column)).toEqual(['format', 'staff']);
    for (const f of found) expect(f).toMatchObject({ count: 1, groups: ['A'] });
  });

  describe('numeric level-2 variables', () => {
    const benches = (values: number[]): Row[] => [
      { g: 'A', benches: 4 },
      { g: 'A', benches: 4 },
      ...values.map((v) => ({ g: 'B', benches: v })),
    ];

    it('8 and 6 vary: the minority record is listed', async () => {
      const f = onlyFinding(await auditRows(benches([8, 8, 6]), { group: 'g', level2: 'benches' }), 'level2-varies');
      expect(f).toMatchObject({ severity: 'blocker', column: 'benches', count: 1, groups: ['B'], rows: [5] });
      expect(f.values).toEqual(['B: 8 ×2 / 6 ×1']);
    });

    it('8 and 8.0004 are constant within tolerance 0.001, but vary with the default tolerance 0', async () => {
      const rows = benches([8, 8.0004, 8]);
      const tolerant = await auditRows(rows, { group: 'g', level2: ['benches'], rules: { 'level2-varies': { tolerance: 0.001 } } });
      expect(findingsOf(tolerant, 'level2-varies')).toEqual([]);
      const strict = onlyFinding(await auditRows(rows, { group: 'g', level2: ['benches'] }), 'level2-varies');
      expect(strict).toMatchObject({ count: 1, groups: ['B'], rows: [4] });
    });

    it('the tolerance is a range: 8, 8.0008, 8.0016 exceed 0.001 together', async () => {
      const rows = benches([8, 8, 8.0008, 8.0016]);
      const f = onlyFinding(
        await auditRows(rows, { group: 'g', level2: ['benches'], rules: { 'level2-varies': { tolerance: 0.001 } } }),
        'level2-varies',
      );
      expect(f).toMatchObject({ count: 1, groups: ['B'] });
      // only the record beyond the tolerance from the usual value 8 is listed
      expect(f.rows).toEqual([6]);
    });

    it('8 and 6 vary whatever small tolerance is set', async () => {
      const f = onlyFinding(
        await auditRows(benches([8, 6]), { group: 'g', level2: ['benches'], rules: { 'level2-varies': { tolerance: 0.5 } } }),
        'level2-varies',
      );
      expect(f.groups).toEqual(['B']);
    });

    it('"8" and "8.0" are one number, but two values when the column is declared categorical', async () => {
      const rows: Row[] = [
        { g: 'A', code: '8' },
        { g: 'A', code: '8.0' },
        { g: 'B', code: '9' },
      ];
      expect(findingsOf(await auditRows(rows, { group: 'g', level2: ['code'] }), 'level2-varies')).toEqual([]);
      const f = onlyFinding(await auditRows(rows, { group: 'g', level2: ['code'], types: { code: 'categorical' } }), 'level2-varies');
      expect(f).toMatchObject({ count: 1, groups: ['A'] });
    });
  });

  it('a tie between two values keeps the smaller as the usual one, deterministically', async () => {
    const rows: Row[] = [
      { g: 'A', format: 'weekly' },
      { g: 'A', format: 'monthly' },
    ];
    for (let k = 0; k < 3; k++) {
      const f = onlyFinding(await auditRows(rows, roles), 'level2-varies');
      expect(f.rows).toEqual([1]); // "monthly" < "weekly", so the weekly record is the odd one
    }
  });

  it('lists the first 20 groups and records but counts them all', async () => {
    // 25 groups of 3, the third record of each differs
    const rows = groupedRows(25, 3, (_, i) => ({ format: i === 2 ? 'monthly' : 'weekly' }));
    const f = onlyFinding(await auditRows(rows, roles), 'level2-varies');
    expect(f.count).toBe(25);
    expect(f.groups).toHaveLength(20);
    expect(f.groups![0]).toBe('G001');
    expect(f.groups![19]).toBe('G020');
    expect(f.rows).toEqual(Array.from({ length: 20 }, (_, j) => 3 * j + 3));
    expect(f.values).toHaveLength(20);
    expectMessage(f, 'varies', { count: 25 });
  });

  it('values withheld: no raw value in the message, fix or values, IDs and records stay', async () => {
    const report = await auditRows(varying, roles, { includeValues: false });
    const f = onlyFinding(report, 'level2-varies');
    expectMessage(f, 'varies', { column: 'format', count: 2 });
    expect(f.message).toMatch(/: \(values withheld\)$/);
    for (const raw of ['weekly', 'monthly', 'pop-up']) expect(JSON.stringify(f)).not.toContain(raw);
    expect(f).not.toHaveProperty('values');
    expect(f.groups).toEqual(['B', 'C']);
    expect(f.rows).toEqual([5, 7]);
    const text = JSON.stringify(report.findings);
    for (const raw of ['weekly', 'monthly', 'pop-up']) expect(text).not.toContain(raw);
  });

  it('severity override and off from the role map', async () => {
    const warned = await auditRows(varying, { ...roles, rules: { 'level2-varies': { severity: 'warning' } } });
    expect(onlyFinding(warned, 'level2-varies')).toMatchObject({ severity: 'warning', count: 2 });
    const off = await auditRows(varying, { ...roles, rules: { 'level2-varies': 'off' } });
    expect(findingsOf(off, 'level2-varies')).toEqual([]);
  });
});
