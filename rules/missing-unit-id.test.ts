import { describe, expect, it } from 'vitest';
import { catalogue } from '../rules/index.js';
import { problemRows } from '../src/problem-rows.js';
import { parseRoles } from '../src/roles/load.js';
import type { Row } from '../test/helpers/delivery.js';
import { auditRows, findingsOf, onlyFinding, toYaml, writeDelivery } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';

const roles = { group: 'site', unit: 'id', outcome: 'y' };
// four blank unit IDs and one "NA" (records 2, 4, 5, 7, 9), in sites S1 and S2; record 9 has no site either
const rows: Row[] = [
  { id: 'U1', site: 'S1', y: 1 },
  { id: '', site: 'S1', y: 2 },
  { id: 'U3', site: 'S1', y: 3 },
  { id: '', site: 'S2', y: 4 },
  { id: 'NA', site: 'S2', y: 5 },
  { id: 'U6', site: 'S2', y: 6 },
  { id: '', site: 'S1', y: 7 },
  { id: 'U8', site: 'S3', y: 8 },
  { id: '', site: '', y: 9 },
  { id: 'U10', site: 'S3', y: 10 },
];

describe('missing-unit-id', () => {
  it('counts and lists the records with a blank or missing-code unit ID, with or without a group', async () => {
    const report = await auditRows(rows, roles);
    const f = onlyFinding(report, 'missing-unit-id');
    expect(f.severity).toBe('warning');
    expect(f.column).toBe('id');
    expect(f.count).toBe(5);
    expect(f.rows).toEqual([2, 4, 5, 7, 9]);
    // counted in the message, not listed (a finding's count would be read as its number of groups)
    expect(f.groups).toBeUndefined();
    expectMessage(f, 'missing', { count: 5, rows: 10, column: 'id', groups: 2 });
    // a missing unit ID is not a repeated one
    expect(findingsOf(report, 'duplicate-unit-id')).toEqual([]);
    expect(report.verdict).not.toBe('ready');
  });

  it('is silent when every record has its unit ID, and without a declared unit', async () => {
    const complete = rows.map((r, i) => ({ ...r, id: `U${i + 1}` }));
    expect(findingsOf(await auditRows(complete, roles), 'missing-unit-id')).toEqual([]);
    expect(findingsOf(await auditRows(rows, { group: 'site', outcome: 'y' }), 'missing-unit-id')).toEqual([]);
  });

  it('uses the role map\'s missing tokens: NA becomes a real ID, "-" missing, blank always missing', async () => {
    const data: Row[] = [
      { id: 'NA', site: 'S1', y: 1 },
      { id: '-', site: 'S1', y: 2 },
      { id: '', site: 'S1', y: 3 },
      { id: 'U4', site: 'S1', y: 4 },
    ];
    const f = onlyFinding(await auditRows(data, { ...roles, missing: ['-'] }), 'missing-unit-id');
    expect(f).toMatchObject({ count: 2, rows: [2, 3] });
    expectMessage(f, 'missing', { count: 2, rows: 4, groups: 1 });
  });

  it('lists the first 20 records, counts all', async () => {
    const data: Row[] = Array.from({ length: 50 }, (_, i) => ({ id: i < 5 ? `U${i}` : '', site: `S${i % 3}`, y: i }));
    const f = onlyFinding(await auditRows(data, roles), 'missing-unit-id');
    expect(f.count).toBe(45);
    expect(f.rows).toEqual(Array.from({ length: 20 }, (_, k) => k + 6));
    expectMessage(f, 'missing', { count: 45, rows: 50, groups: 3 });
  });

  it('severity override and off', async () => {
    const blocked = await auditRows(rows, { ...roles, rules: { 'missing-unit-id': { severity: 'blocker' } } });
    expect(onlyFinding(blocked, 'missing-unit-id')).toMatchObject({ severity: 'blocker', count: 5 });
    const off = await auditRows(rows, { ...roles, rules: { 'missing-unit-id': 'off' } });
    expect(findingsOf(off, 'missing-unit-id')).toEqual([]);
  });

  it('gives every such record its own row in the problem-rows file', async () => {
    const d = writeDelivery(rows, roles);
    try {
      const parsed = parseRoles(toYaml(roles), d.roles, catalogue).roles;
      const report = await auditRows(rows, roles);
      const found = await problemRows(d.csv, parsed, report.findings);
      const mine = found.rows.filter((r) => r.rule === 'missing-unit-id');
      expect(mine.map((r) => [r.record, r.group, r.unit])).toEqual([
        [2, 'S1', null],
        [4, 'S2', null],
        [5, 'S2', null],
        [7, 'S1', null],
        [9, null, null],
      ]);
      expect(mine[0].reason).toBe('no id (blank or a missing code): the record cannot be matched to its unit');
    } finally {
      d.remove();
    }
  });
});
