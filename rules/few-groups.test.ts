import { describe, expect, it } from 'vitest';
import { grade } from '../src/grade.js';
import { checkRule, profileOfGroups } from '../test/helpers/check-rule.js';
import { auditRows, groupedRows, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';

// two records per group (the rule reads only how many groups there are)
const groupsOf = (groups: number) => profileOfGroups(Array(groups).fill(2));
const check = async (groups: number, rules?: Record<string, unknown>) =>
  checkRule('few-groups', await groupsOf(groups), { group: 'g', ...(rules && { rules: { 'few-groups': rules } }) });

describe('few-groups', () => {
  it.each([
    [1, 'blocker', 'floor', 10],
    [9, 'blocker', 'floor', 10],
    [10, 'warning', 'usual', 30],
    [29, 'warning', 'usual', 30],
    [30, 'note', 'strict', 50],
    [50, 'note', 'strict', 50],
    [51, undefined, undefined, undefined],
  ] as const)('%i groups → %s (defaults 10 / 30 / 50)', async (groups, severity, messageId, limit) => {
    const found = await check(groups);
    if (severity === undefined) {
      expect(found).toEqual([]);
      return;
    }
    expect(found).toHaveLength(1);
    const f = found[0];
    expect(f.severity).toBe(severity);
    expect(f.count).toBe(groups);
    expect(f.column).toBeUndefined();
    expect(f.groups).toBeUndefined();
    expect(f.rows).toBeUndefined();
    expectMessage(f, messageId!, { count: groups, limit: limit! });
  });

  it('takes thresholds from the role map', async () => {
    const rules = { block_below: 2, warn_below: 5, note_below: 6 };
    const at = async (groups: number) => check(groups, rules);
    expect((await at(1))[0]).toMatchObject({ severity: 'blocker', count: 1 });
    expect((await at(2))[0]).toMatchObject({ severity: 'warning', count: 2 });
    expectMessage((await at(4))[0], 'usual', { count: 4, limit: 5 });
    expect((await at(5))[0]).toMatchObject({ severity: 'note', count: 5 });
    expectMessage((await at(6))[0], 'strict', { count: 6, limit: 6 });
    expect(await at(7)).toEqual([]);
  });

  it('a partial override keeps the other defaults', async () => {
    // 9 < block_below 10 still blocks, whatever warn_below says
    expect((await check(9, { warn_below: 5 }))[0].severity).toBe('blocker');
    expect((await check(20, { warn_below: 5 }))[0]).toMatchObject({ severity: 'note', count: 20 });
  });

  it('a severity override replaces the graded severity', async () => {
    const found = await check(3, { severity: 'note' });
    expect(found[0]).toMatchObject({ severity: 'note', count: 3 });
    expect(grade(found).verdict).toBe('ready');
  });

  it('can be turned off', async () => {
    expect(await checkRule('few-groups', await groupsOf(3), { group: 'g', rules: { 'few-groups': 'off' } })).toEqual([]);
  });

  it('does not count records with a missing group ID as a group', async () => {
    const rows = [...groupedRows(10, 2, (j, i) => ({ y: j + i })), { g: '', y: 1 }, { g: 'NA', y: 2 }];
    const report = await auditRows(rows, { group: 'g' });
    expect(report.groups.count).toBe(10);
    expect(onlyFinding(report, 'few-groups')).toMatchObject({ severity: 'warning', count: 10 });
  });
});
