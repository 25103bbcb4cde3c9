import { describe, expect, it } from 'vitest';
import { grade } from '../src/grade.js';
import { checkRule, profileOfGroups } from '../test/helpers/check-rule.js';
import type { Row } from '../test/helpers/delivery.js';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';

const roles = { group: 'g' };
/** `groups` groups, the last `singles` of which hold one record, the others two. */
const delivery = (groups: number, singles: number) => groupedRows(groups, (j) => (j >= groups - singles ? 1 : 2));
/** The same groups as a built profile, for the cases that need no delivery. */
const sizes = (groups: number, singles: number) =>
  profileOfGroups(Array.from({ length: groups }, (_, j) => (j >= groups - singles ? 1 : 2)));
const check = async (groups: number, singles: number, rules?: unknown) => {
  const settings = rules !== undefined && { rules: { 'singleton-groups': rules } };
  return checkRule('singleton-groups', await sizes(groups, singles), { group: 'g', ...settings });
};
const only = (found: Awaited<ReturnType<typeof check>>) => {
  expect(found).toHaveLength(1);
  return found[0];
};

describe('singleton-groups', () => {
  it("lists the single-record groups, not their record numbers (a group's ID finds its one record)", async () => {
    const rows: Row[] = [
      { g: 'A', y: 1 },
      { g: 'B', y: 2 },
      { g: 'A', y: 3 },
      { g: 'C', y: 4 },
      { g: 'D', y: 5 },
      { g: 'C', y: 6 },
      { g: 'E', y: 7 },
      { g: 'C', y: 8 },
      { g: 'A', y: 9 },
      { g: 'F', y: 10 },
      { g: 'F', y: 11 },
    ];
    const report = await auditRows(rows, roles);
    const f = onlyFinding(report, 'singleton-groups');
    expect(f.count).toBe(3);
    expect(f.groups).toEqual(['B', 'D', 'E']);
    // no look-up for record numbers: it cost a numbered scan of the delivery (the problem-rows file has them)
    expect(f.rows).toBeUndefined();
    expect(f.column).toBeUndefined();
    expectMessage(f, 'singletons', { count: 3, groups: 6, share: '50.0%' });
    expect(report.groups.singletons).toBe(3);
  });

  it('is silent when every group has two records or more', async () => {
    expect(await check(10, 0)).toEqual([]);
  });

  it.each([
    // groups, singletons → severity (defaults: warning at ≥ 10%, blocker at ≥ 50%, under 400 groups)
    [20, 1, 'note'], // 5%
    [11, 1, 'note'], // 9.1%
    [10, 1, 'warning'], // exactly 10%
    [10, 4, 'warning'], // 40%
    [10, 5, 'blocker'], // exactly 50%
    [10, 10, 'blocker'],
  ] as const)('%i groups, %i singletons → %s', async (groups, singles, severity) => {
    const f = only(await check(groups, singles));
    expect(f.severity).toBe(severity);
    expect(f.count).toBe(singles);
    expectMessage(f, 'singletons', { count: singles, groups, share: `${((100 * singles) / groups).toFixed(1)}%` });
  });

  it('with at least many_groups groups singletons are only noted (default 400)', async () => {
    expect(only(await check(400, 400))).toMatchObject({ severity: 'note', count: 400 });
    expect(only(await check(399, 399))).toMatchObject({ severity: 'blocker', count: 399 });
  });

  it('lists the first 20 groups, counts all', async () => {
    const f = only(await check(399, 399));
    expect(f.groups).toEqual(Array.from({ length: 20 }, (_, j) => `G${String(j + 1).padStart(3, '0')}`));
  });

  it('takes share thresholds and many_groups from the role map', async () => {
    const rules = { warn_share: 0.3, block_share: 0.8, many_groups: 20 };
    const sev = async (groups: number, singles: number) => only(await check(groups, singles, rules)).severity;
    expect(await sev(10, 2)).toBe('note');
    expect(await sev(10, 3)).toBe('warning');
    expect(await sev(10, 8)).toBe('blocker');
    expect(await sev(20, 20)).toBe('note'); // many_groups reached
  });

  it('severity override from the role map, and off', async () => {
    const forced = await check(20, 1, { severity: 'blocker' });
    expect(only(forced)).toMatchObject({ severity: 'blocker', count: 1 });
    expect(grade(forced).verdict).toBe('not-ready');
    expect(await check(10, 10, 'off')).toEqual([]);
  });

  it('records with a missing group ID are not a singleton group', async () => {
    const rows = [...delivery(10, 0), { g: '' }];
    expect(findingsOf(await auditRows(rows, roles), 'singleton-groups')).toEqual([]);
  });
});
