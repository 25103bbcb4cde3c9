import { describe, expect, it } from 'vitest';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';

// two records per group, so no singleton findings get in the way
const delivery = (groups: number) => groupedRows(groups, 2, (j, i) => ({ y: j + i }));
const roles = { group: 'g' };

describe('few-groups', () => {
  it.each([
    [1, 'blocker'],
    [9, 'blocker'],
    [10, 'warning'],
    [29, 'warning'],
    [30, 'note'],
    [50, 'note'],
    [51, undefined],
  ] as const)('%i groups → %s (defaults 10 / 30 / 50)', async (groups, severity) => {
    const report = await auditRows(delivery(groups), roles);
    expect(report.groups.count).toBe(groups);
    const found = findingsOf(report, 'few-groups');
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
    expect(f.message).toContain(`${groups} groups`);
  });

  it('says what to ask for at each grade', async () => {
    const blocker = onlyFinding(await auditRows(delivery(9), roles), 'few-groups');
    expect(blocker.message).toContain('fewer than 10');
    expect(blocker.fix).toMatch(/more groups can be delivered/);
    const warning = onlyFinding(await auditRows(delivery(10), roles), 'few-groups');
    expect(warning.message).toContain('fewer than the usual recommendation of 30');
    expect(warning.fix).toMatch(/add groups|Kenward/);
    const note = onlyFinding(await auditRows(delivery(50), roles), 'few-groups');
    expect(note.message).toContain('at or below 50');
    expect(note.fix).toMatch(/no change to the delivery is needed/);
  });

  it('takes thresholds from the role map', async () => {
    const rules = { 'few-groups': { block_below: 2, warn_below: 5, note_below: 6 } };
    const at = async (groups: number) => findingsOf(await auditRows(delivery(groups), { group: 'g', rules }), 'few-groups');
    expect((await at(1))[0]).toMatchObject({ severity: 'blocker', count: 1 });
    expect((await at(2))[0]).toMatchObject({ severity: 'warning', count: 2 });
    expect((await at(4))[0].message).toContain('fewer than the usual recommendation of 5');
    expect((await at(5))[0]).toMatchObject({ severity: 'note', count: 5 });
    expect((await at(6))[0].message).toContain('at or below 6');
    expect(await at(7)).toEqual([]);
  });

  it('a partial override keeps the other defaults', async () => {
    const report = await auditRows(delivery(9), { group: 'g', rules: { 'few-groups': { warn_below: 5 } } });
    // 9 < block_below 10 still blocks, whatever warn_below says
    expect(onlyFinding(report, 'few-groups').severity).toBe('blocker');
    const twenty = await auditRows(delivery(20), { group: 'g', rules: { 'few-groups': { warn_below: 5 } } });
    expect(onlyFinding(twenty, 'few-groups')).toMatchObject({ severity: 'note', count: 20 });
  });

  it('a severity override replaces the graded severity', async () => {
    const report = await auditRows(delivery(3), { group: 'g', rules: { 'few-groups': { severity: 'note' } } });
    expect(onlyFinding(report, 'few-groups')).toMatchObject({ severity: 'note', count: 3 });
    expect(report.verdict).toBe('ready');
  });

  it('can be turned off', async () => {
    const report = await auditRows(delivery(3), { group: 'g', rules: { 'few-groups': 'off' } });
    expect(findingsOf(report, 'few-groups')).toEqual([]);
  });

  it('does not count records with a missing group ID as a group', async () => {
    const rows = [...delivery(10), { g: '', y: 1 }, { g: 'NA', y: 2 }];
    const report = await auditRows(rows, roles);
    expect(onlyFinding(report, 'few-groups')).toMatchObject({ severity: 'warning', count: 10 });
  });
});
