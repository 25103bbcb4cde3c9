import { describe, expect, it } from 'vitest';
import { tokenKinds } from '../src/rules/token-kind.js';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';
import { tokenKind } from './non-numeric-values.js';

// 5 groups of 20 numeric outcomes; records 3, 25, 47 are "n/a", 60 is "<5", 81 is "1,234"
const TOKENS: Record<number, string> = { 3: 'n/a', 25: 'n/a', 47: 'n/a', 60: '<5', 81: '1,234' };
const rows = groupedRows(5, 20, (j, i) => ({ y: TOKENS[j * 20 + i + 1] ?? String(10 + i + j) }));

describe('non-numeric-values', () => {
  it('lists each token with its count and first records, and what it looks like', async () => {
    const f = onlyFinding(await auditRows(rows, { group: 'g', outcome: 'y' }), 'non-numeric-values');
    expect(f.severity).toBe('blocker'); // 5 of 100 = 5% ≥ block_share 0.05
    expect(f.column).toBe('y');
    expect(f.count).toBe(5);
    expect(f.rows).toEqual([3, 25, 47, 60, 81]);
    expect(f.values).toEqual(['"n/a" ×3 (records 3, 25, 47)', '"1,234" ×1 (records 81)', '"<5" ×1 (records 60)']);
    const kinds = '3 missing codes, 1 thousands separator, 1 censored value';
    expectMessage(f, 'tokens', { column: 'y', count: 5, present: 100, share: '5.0%', kinds });
  });

  it('a few tokens warn; with values withheld the tokens are not shown', async () => {
    const one = rows.map((r, k) => (k === 59 || k === 80 || k === 24 || k === 46 ? { ...r, y: '12' } : r));
    const f = onlyFinding(await auditRows(one, { group: 'g', outcome: 'y' }, { includeValues: false }), 'non-numeric-values');
    expect(f).toMatchObject({ severity: 'warning', count: 1, rows: [3] });
    expect(f.values).toBeUndefined();
    expect(f.message).toContain('(values withheld)');
    expect(JSON.stringify(f)).not.toContain('n/a');
  });

  it('is silent once the token is a declared missing code, and for all-number columns', async () => {
    const declared = await auditRows(
      rows.filter((r) => !['<5', '1,234'].includes(String(r.y))),
      { group: 'g', outcome: 'y', missing: ['', 'n/a'] },
    );
    expect(findingsOf(declared, 'non-numeric-values')).toEqual([]);
    const clean = groupedRows(5, 4, (j, i) => ({ y: i + j }));
    expect(findingsOf(await auditRows(clean, { group: 'g', outcome: 'y' }), 'non-numeric-values')).toEqual([]);
  });

  it('tokenKind', () => {
    expect(tokenKind('N/A')).toBe('missing code');
    expect(tokenKind('<5')).toBe('censored value');
    expect(tokenKind('1,234')).toBe('thousands separator');
    expect(tokenKind('3,5')).toBe('decimal comma');
    expect(tokenKind('12 kg')).toBe('number with a unit');
    expect(tokenKind('abc')).toBe('other text');
  });

  it('a "1,234" beside values that can only be decimal commas is a decimal comma, not a thousands separator', async () => {
    const kindOf = tokenKinds(['12,5', '1,234']);
    expect([kindOf('12,5'), kindOf('1,234')]).toEqual(['decimal comma', 'decimal comma']);
    // a number that can only have thousands separators keeps "1,234" one
    const thousands = tokenKinds(['12,5', '1,234', '1,234,567']);
    expect([thousands('1,234'), thousands('1,234,567')]).toEqual(['thousands separator', 'thousands separator']);
    const mixed = groupedRows(5, 20, (j, i) => ({ y: j * 20 + i === 7 ? '12,5' : j * 20 + i === 9 ? '1,234' : String(10 + i + j) }));
    const f = onlyFinding(await auditRows(mixed, { group: 'g', outcome: 'y' }), 'non-numeric-values');
    expectMessage(f, 'tokens', { column: 'y', count: 2, kinds: '2 decimal commas' });
  });
});
