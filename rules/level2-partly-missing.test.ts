import { describe, expect, it } from 'vitest';
import type { Row } from '../test/helpers/delivery.js';
import { auditRows, findingsOf, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';

// A: weekly on 3 records, missing on record 4 (obvious fill); B: values disagree and record 7 is missing;
// C: complete; D: missing everywhere (that is missing-by-group's all-missing case, not this one)
const rows: Row[] = [
  { g: 'A', fmt: 'weekly' },
  { g: 'A', fmt: 'weekly' },
  { g: 'A', fmt: 'weekly' },
  { g: 'A', fmt: '' },
  { g: 'B', fmt: 'monthly' },
  { g: 'B', fmt: 'weekly' },
  { g: 'B', fmt: 'NA' },
  { g: 'C', fmt: 'pop-up' },
  { g: 'C', fmt: 'pop-up' },
  { g: 'D', fmt: '' },
  { g: 'D', fmt: '' },
];
const roles = { group: 'g', level2: ['fmt'] };

describe('level2-partly-missing', () => {
  it('names the groups, the records to fill and, where the group agrees, the value', async () => {
    const f = onlyFinding(await auditRows(rows, roles), 'level2-partly-missing');
    expect(f.severity).toBe('warning');
    expect(f.column).toBe('fmt');
    expect(f.count).toBe(2);
    expect(f.groups).toEqual(['A', 'B']);
    expect(f.rows).toEqual([4, 7]);
    expect(f.values).toEqual(['A: weekly (on 3 of 4)', 'B: values disagree (on 2 of 3)']);
    expectMessage(f, 'partly', { column: 'fmt', missing: 2, count: 2, agree: 1 });
    expect(f.values?.[0]).toBe('A: weekly (on 3 of 4)');
  });

  it('works for numeric level-2 variables, and keeps values out when asked', async () => {
    const numeric: Row[] = [
      { g: 'A', staff: 4 },
      { g: 'A', staff: null },
      { g: 'B', staff: 7 },
      { g: 'B', staff: 7 },
    ];
    const f = onlyFinding(await auditRows(numeric, { group: 'g', level2: ['staff'] }, { includeValues: false }), 'level2-partly-missing');
    expect(f.rows).toEqual([2]);
    expect(f.values).toBeUndefined();
    expect(f.message).toContain('(values withheld)');
  });

  it('is silent when every group has its value on all records or on none', async () => {
    const clean = rows.filter((r) => r.g === 'C' || r.g === 'D');
    expect(findingsOf(await auditRows(clean, roles), 'level2-partly-missing')).toEqual([]);
  });
});
