import { describe, expect, it } from 'vitest';
import { auditRows, findingsOf, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';
import { parentRows } from '../test/helpers/parent-rows.js';

const roles = { group: 'g', parent: 'p', level2: ['size'] };

describe('group-code-reused', () => {
  it('names a code used by two parents for groups that differ, and asks for a composite key', async () => {
    const report = await auditRows(parentRows, roles);
    const f = onlyFinding(report, 'group-code-reused');
    expect(f.severity).toBe('blocker');
    expect(f.count).toBe(1);
    expect(f.groups).toEqual(['B']);
    expect(f.rows).toEqual([7, 8, 9, 10, 11, 12]);
    expectMessage(f, 'reused', { group: 'g', parent: 'p', column: 'size' });
    expect(f.data.splits).toContain('B: north (3) / south (3)');
    expect(f.values).toEqual(['B: size 10 / 20']);
    // the same group is not also reported as split
    expect(onlyFinding(report, 'group-in-several-parents').groups).toEqual(['A']);
  });

  it('is silent without a parent or without level-2 evidence', async () => {
    expect(findingsOf(await auditRows(parentRows, { group: 'g', level2: ['size'] }), 'group-code-reused')).toEqual([]);
    expect(findingsOf(await auditRows(parentRows, { group: 'g', parent: 'p' }), 'group-code-reused')).toEqual([]);
  });
});
