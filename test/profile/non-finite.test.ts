import { describe, expect, it } from 'vitest';
import { tokenKind } from '../../rules/non-numeric-values.js';
import { auditRows, groupedRows, onlyFinding } from '../helpers/delivery.js';

/** 6 groups of 5: y = 10 + i + j, with the given tokens put at records (1-based). */
function withTokens(tokens: Record<number, string>) {
  return groupedRows(6, 5, (j, i) => ({ y: tokens[j * 5 + i + 1] ?? String(10 + i + 2 * j) }));
}

describe('non-finite and overflowing values are a finding, never a crash', () => {
  it.each([
    ['-inf', { 3: '-inf' }, ['"-inf" ×1 (records 3)'], 'non-finite value'],
    ['NaN', { 7: 'NaN', 8: 'nan' }, null, 'non-finite value'],
    ['1e309 (read as inf)', { 11: '1e309' }, null, null],
    ['1e308 constants in two groups', { 1: '1e308', 2: '1e308', 6: '1e308', 7: '1e308' }, null, 'out-of-range value'],
  ])('%s', async (_, tokens, values, kind) => {
    const report = await auditRows(withTokens(tokens), { group: 'g', outcome: 'y' });
    const f = onlyFinding(report, 'non-numeric-values', 'y');
    const records = Object.keys(tokens).map(Number);
    expect(f.count).toBe(records.length);
    expect(f.rows).toEqual(records);
    if (values) expect(f.values).toEqual(values);
    if (kind) expect(f.message).toContain(kind);
    // the statistics are those of the finite values: all finite
    const stats = report.outcomes.y;
    expect(stats).toBeDefined();
    for (const [name, v] of Object.entries(stats)) if (typeof v === 'number') expect(Number.isFinite(v), name).toBe(true);
  });

  it('values up to ±1e100 are numbers; beyond, out of range', async () => {
    const report = await auditRows(withTokens({ 4: '9.9e99', 5: '-1e101' }), { group: 'g', outcome: 'y' });
    const f = onlyFinding(report, 'non-numeric-values', 'y');
    expect(f.rows).toEqual([5]);
  });

  it('tokenKind names them', () => {
    expect(tokenKind('-Infinity')).toBe('non-finite value');
    expect(tokenKind('nan')).toBe('non-finite value');
    expect(tokenKind('1e308')).toBe('out-of-range value');
  });
});
