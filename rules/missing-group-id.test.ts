import { describe, expect, it } from 'vitest';
import type { Row } from '../test/helpers/delivery.js';
import { auditRows, findingsOf, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';

const roles = { group: 'site', outcome: 'y' };
// records 2 (blank) and 5 (NA) have no site
const rows: Row[] = [
  { site: 'S1', y: 1 },
  { site: '', y: 2 },
  { site: 'S1', y: 3 },
  { site: 'S2', y: 4 },
  { site: 'NA', y: 5 },
  { site: 'S2', y: 6 },
];

describe('missing-group-id', () => {
  it('counts and lists the records with a blank or missing-code group ID', async () => {
    const report = await auditRows(rows, roles);
    const f = onlyFinding(report, 'missing-group-id');
    expect(f.severity).toBe('blocker');
    expect(f.column).toBe('site');
    expect(f.count).toBe(2);
    expect(f.rows).toEqual([2, 5]);
    expect(f.groups).toBeUndefined();
    expectMessage(f, 'missing', { count: 2, rows: 6, column: 'site' });
    // they are records, but not a group
    expect(report.input.rows).toBe(6);
    expect(report.groups.count).toBe(2);
  });

  it('is silent when every record has a group ID', async () => {
    const complete = rows.map((r, i) => ({ ...r, site: i < 3 ? 'S1' : 'S2' }));
    expect(findingsOf(await auditRows(complete, roles), 'missing-group-id')).toEqual([]);
  });

  it('every default missing token counts', async () => {
    const tokens = ['', 'NA', 'N/A', 'NULL', 'null', '.'];
    const data: Row[] = [{ site: 'S1', y: 0 }, ...tokens.map((t, i) => ({ site: t, y: i })), { site: 'S1', y: 9 }];
    const f = onlyFinding(await auditRows(data, roles), 'missing-group-id');
    expect(f.count).toBe(6);
    expect(f.rows).toEqual([2, 3, 4, 5, 6, 7]);
  });

  it('a quoted empty field is missing too', async () => {
    const f = onlyFinding(await auditRows('site,y\nS1,1\n"",2\nS1,3\n', roles), 'missing-group-id');
    expect(f).toMatchObject({ count: 1, rows: [2] });
  });

  it('uses the role map\'s missing tokens: NA becomes a real ID, "-" missing, blank always missing', async () => {
    const data: Row[] = [
      { site: 'NA', y: 1 },
      { site: '-', y: 2 },
      { site: '', y: 3 },
      { site: 'NA', y: 4 },
    ];
    const report = await auditRows(data, { ...roles, missing: ['-'] });
    expect(onlyFinding(report, 'missing-group-id')).toMatchObject({ count: 2, rows: [2, 3] });
    expect(report.groups.count).toBe(1);
  });

  it('a group ID of only spaces is blank', async () => {
    const report = await auditRows('site,y\nS1,1\n   ,2\n" ",3\nS1,4\n', roles);
    expect(onlyFinding(report, 'missing-group-id')).toMatchObject({ count: 2, rows: [2, 3] });
    expect(report.groups.count).toBe(1);
  });

  it('an ID with a trailing space is an ID of its own, not missing', async () => {
    const report = await auditRows('site,y\nS1,1\n"S1 ",2\nS1,3\n', roles);
    expect(findingsOf(report, 'missing-group-id')).toEqual([]);
    expect(report.groups.count).toBe(2);
  });

  it('lists the first 20 records, counts all', async () => {
    const data: Row[] = Array.from({ length: 30 }, (_, i) => ({ site: i % 2 ? '' : 'S1', y: i }));
    const f = onlyFinding(await auditRows(data, roles), 'missing-group-id');
    expect(f.count).toBe(15);
    expect(f.rows).toEqual(Array.from({ length: 15 }, (_, k) => 2 * k + 2).slice(0, 20));
    const many: Row[] = Array.from({ length: 50 }, (_, i) => ({ site: i < 5 ? 'S1' : '', y: i }));
    const g = onlyFinding(await auditRows(many, roles), 'missing-group-id');
    expect(g.count).toBe(45);
    expect(g.rows).toEqual(Array.from({ length: 20 }, (_, k) => k + 6));
    expectMessage(g, 'missing', { count: 45, rows: 50 });
  });

  it('severity override and off', async () => {
    const warned = await auditRows(rows, { ...roles, rules: { 'missing-group-id': { severity: 'warning' } } });
    expect(onlyFinding(warned, 'missing-group-id')).toMatchObject({ severity: 'warning', count: 2 });
    const off = await auditRows(rows, { ...roles, rules: { 'missing-group-id': 'off' } });
    expect(findingsOf(off, 'missing-group-id')).toEqual([]);
  });
});
