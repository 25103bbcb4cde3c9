import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { audit } from '../../src/audit.js';
import type { Report } from '../../src/report/types.js';
import { loadRoles } from '../../src/roles/load-file.js';
import { redactUrl } from '../../src/source/engines/postgres/input.js';
import { expectSameAudit } from '../source/formats/same.js';
import { dropTables, loadCsv, TYPED } from './load.js';

// .ci/run starts a throwaway server (scripts/pg-server.sh) and exports NESTREADY_PG_URL; outside
// CI the test is skipped when no server is given, but in CI a missing server is a failure
const url = process.env.NESTREADY_PG_URL;
if (!url && process.env.CI) throw new Error('CI: NESTREADY_PG_URL is not set (.ci/run starts PostgreSQL for test/postgres)');

const DEMO = 'fixtures/demo/repairs-delivery.csv';
const ROLES = 'fixtures/demo/repairs-delivery.roles.yaml';

describe.skipIf(!url)('PostgreSQL push-down: the same audit where the delivery lives', () => {
  const roles = loadRoles(ROLES, catalogue);
  let file: Report;
  beforeAll(async () => {
    await loadCsv(url!, DEMO, 'nr_test_repairs_text');
    await loadCsv(url!, DEMO, 'nr_test_repairs_typed', TYPED);
    file = await audit(DEMO, roles);
  });
  afterAll(async () => {
    await dropTables(url!, ['nr_test_repairs_text', 'nr_test_repairs_typed']);
  });

  it('a table of text columns, as delivered, gives the report of the file', async () => {
    const db = await audit({ url: url!, table: 'nr_test_repairs_text' }, roles);
    expectSameAudit(db, file);
    expect(db.input.path).toBe(`${redactUrl(url!)}#table=nr_test_repairs_text`);
  });

  it('a typed table (integer and double columns) gives the report of the file', async () => {
    expectSameAudit(await audit({ url: url!, table: 'public.nr_test_repairs_typed' }, roles), file);
  });

  it('a query gives the report of the file (rows numbered in the order it returns them)', async () => {
    const db = await audit({ url: url!, query: 'SELECT * FROM nr_test_repairs_text ORDER BY ctid' }, roles);
    expectSameAudit(db, file);
  });

  it('a missing table is an input error that names it, without the password', async () => {
    const withPassword = url!.replace('postgres@', 'postgres:secret@');
    await expect(audit({ url: withPassword, table: 'no_such_table' }, roles)).rejects.toThrow(/no such table/);
    await expect(audit({ url: withPassword, table: 'no_such_table' }, roles)).rejects.not.toThrow(/secret/);
  });
});
