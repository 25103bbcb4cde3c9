import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { audit } from '../../src/audit.js';
import { problemRows } from '../../src/problem-rows.js';
import type { ProblemRows } from '../../src/problems/types.js';
import { loadRoles } from '../../src/roles/load-file.js';
import { nestready } from '../helpers/cli.js';
import type { Delivery, Row } from '../helpers/delivery.js';
import { writeDelivery } from '../helpers/delivery.js';
import { dropTables, loadCsv, TYPED } from './load.js';

// see parity.test.ts: .ci/run starts the server; outside CI the test is skipped without one
const url = process.env.NESTREADY_PG_URL;
if (!url && process.env.CI) throw new Error('CI: NESTREADY_PG_URL is not set (.ci/run starts PostgreSQL for test/postgres)');

const DEMO = 'fixtures/demo/repairs-delivery.csv';
const ROLES = 'fixtures/demo/repairs-delivery.roles.yaml';

// a small delivery with every kind of send-back row: missing group IDs, singletons, a text and a
// numeric level-2 variable that vary, a repeated unit ID (listed records), a missing unit ID and a
// level-2 value missing on one record of a group
const rows: Row[] = [
  { u: 'a1', g: 'G1', site: 'north', staff: 3, y: 1 },
  { u: 'a2', g: 'G1', site: 'north', staff: 3, y: 2 },
  { u: 'a3', g: 'G1', site: 'south', staff: 4, y: 3 },
  { u: 'a4', g: 'G2', site: 'east', staff: 5, y: 4 },
  { u: 'a4', g: 'G2', site: 'east', staff: 5, y: 5 },
  { u: 'a6', g: '', site: 'east', staff: 5, y: 6 },
  { u: 'a7', g: 'G3', site: 'west', staff: 2, y: 7 },
  { u: 'a8', g: 'G2', site: 'east', staff: 5, y: 8 },
  { u: 'a9', g: 'G4', site: 'west', staff: 2, y: 9 },
  // a missing unit ID; site missing on one record of G5 (the group's value named from the others)
  { u: '', g: 'G5', site: 'west', staff: 2, y: 10 },
  { u: 'b2', g: 'G5', site: null, staff: 2, y: 11 },
  { u: 'b3', g: 'G5', site: 'west', staff: 2, y: 12 },
];
const roleMap = { group: 'g', unit: 'u', outcomes: ['y'], level2: ['site', 'staff'], types: { site: 'categorical' } };

const byRule = (found: ProblemRows) => found.rows.map((r) => [r.rule, r.record, r.group, r.unit, r.column ?? '', r.reason].join('|'));

describe.skipIf(!url)('--problems on PostgreSQL: the rows of the file it was loaded from', () => {
  let d: Delivery;
  beforeAll(async () => {
    d = writeDelivery(rows, roleMap);
    await loadCsv(url!, d.csv, 'nr_test_rows_text');
    await loadCsv(url!, DEMO, 'nr_test_rows_demo');
    await loadCsv(url!, DEMO, 'nr_test_rows_demo_typed', TYPED);
  });
  afterAll(async () => {
    d?.remove();
    await dropTables(url!, ['nr_test_rows_text', 'nr_test_rows_demo', 'nr_test_rows_demo_typed']);
  });

  it('a delivery with every kind of problem row', async () => {
    const roles = loadRoles(d.roles, catalogue).roles;
    const report = await audit(d.csv, roles);
    const file = await problemRows(d.csv, roles, report.findings);
    const db = await problemRows({ url: url!, table: 'nr_test_rows_text' }, roles, report.findings);
    const kinds = new Set([
      'missing-group-id',
      'singleton-groups',
      'level2-varies',
      'duplicate-unit-id',
      'missing-unit-id',
      'level2-partly-missing',
    ]);
    expect(new Set(file.rows.map((r) => r.rule))).toEqual(kinds);
    expect(byRule(db)).toEqual(byRule(file));
    expect(db.total).toBe(file.total);
    // the numeric level-2 column is compared as numbers in both: no quotes around its values
    expect(db.rows.find((r) => r.column === 'staff')?.reason).toBe('staff is 4 here but 3 in most records of the group');
    expect(db.rows.find((r) => r.rule === 'level2-partly-missing')?.reason).toBe(
      'site is missing here; the other records of the group have "west" (the most common value)',
    );
    expect(db.rows.filter((r) => r.rule === 'missing-unit-id').map((r) => [r.record, r.group])).toEqual([[10, 'G5']]);
    // the rule's own look-up (lookup.rowsMissing) in PostgreSQL's dialect
    const viaDb = await audit({ url: url!, table: 'nr_test_rows_text' }, roles);
    const missingUnit = (r: typeof report) => r.findings.find((f) => f.rule === 'missing-unit-id');
    expect(missingUnit(viaDb)).toMatchObject({ count: 1, rows: [10] });
    expect(missingUnit(viaDb)).toEqual(missingUnit(report));
  });

  it.each([
    ['a table of text columns', 'nr_test_rows_demo'],
    ['a typed table', 'nr_test_rows_demo_typed'],
  ])('the demo delivery: %s', async (_, table) => {
    const roles = loadRoles(ROLES, catalogue).roles;
    const report = await audit(DEMO, roles);
    const file = await problemRows(DEMO, roles, report.findings);
    const db = await problemRows({ url: url!, table }, roles, report.findings);
    expect(file.rows.length).toBeGreaterThan(0);
    expect(byRule(db)).toEqual(byRule(file));
    expect([db.total, db.omitted]).toEqual([file.total, file.omitted]);
  });

  it('the CLI writes the same problem-rows file for --source as for the file', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'nestready-pg-rows-'));
    try {
      const [file, db] = await Promise.all([
        nestready('audit', DEMO, '-r', ROLES, '-q', '--problems', join(dir, 'file.csv')),
        nestready('audit', '--source', url!, '--table', 'nr_test_rows_demo', '-r', ROLES, '-q', '--problems', join(dir, 'db.csv')),
      ]);
      expect(db.stderr).toBe('');
      expect(db.code).toBe(file.code);
      const text = readFileSync(join(dir, 'db.csv'), 'utf8');
      expect(text.split('\r\n').length).toBeGreaterThan(2);
      expect(text).toBe(readFileSync(join(dir, 'file.csv'), 'utf8'));
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
