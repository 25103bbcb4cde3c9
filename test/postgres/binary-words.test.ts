import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { audit } from '../../src/audit.js';
import type { Report } from '../../src/report/types.js';
import { parseRoles } from '../../src/roles/load.js';
import { expectSameAudit } from '../source/formats/same.js';
import { dropTables, loadCsv } from './load.js';

const url = process.env.NESTREADY_PG_URL;
if (!url && process.env.CI) throw new Error('CI: NESTREADY_PG_URL is not set (.ci/run starts PostgreSQL for test/postgres)');

const CLEAN = 'fixtures/demo/repairs-clean.csv';
const rolesText = readFileSync('fixtures/demo/repairs-clean.roles.yaml', 'utf8').replace(
  'outcomes: [repair_minutes]',
  'outcomes: [repair_minutes, fixed]',
);

describe.skipIf(!url)('PostgreSQL: a binary outcome written in words is read as 0/1 as from the file', () => {
  const dir = mkdtempSync(join(tmpdir(), 'nestready-pg-words-'));
  const worded = join(dir, 'worded.csv');
  let file: Report;
  const roles = parseRoles(rolesText, 'roles.yaml', catalogue);
  const flipped = parseRoles(
    rolesText.replace('types: { fixed: binary }', 'types: { fixed: { binary: { one: no } } }'),
    'roles.yaml',
    catalogue,
  );
  beforeAll(async () => {
    const lines = readFileSync(CLEAN, 'utf8').trim().split('\n');
    const at = lines[0].split(',').indexOf('fixed');
    const out = lines.map((l, i) =>
      i === 0
        ? l
        : l
            .split(',')
            .map((v, k) => (k === at ? (v === '1' ? 'Yes' : 'No') : v))
            .join(','),
    );
    writeFileSync(worded, `${out.join('\n')}\n`);
    await loadCsv(url!, worded, 'nr_test_words_text');
    await loadCsv(url!, CLEAN, 'nr_test_words_bool', { fixed: 'boolean' });
    file = await audit(worded, roles);
  });
  afterAll(async () => {
    rmSync(dir, { recursive: true, force: true });
    await dropTables(url!, ['nr_test_words_text', 'nr_test_words_bool']);
  });

  it('a text column of Yes/No gives the report of the file, with the same mapping', async () => {
    const db = await audit({ url: url!, table: 'nr_test_words_text' }, roles);
    expectSameAudit(db, file);
    expect(db.input.reading).toEqual(file.input.reading);
    expect(db.input.reading?.binary?.fixed).toEqual({ one: 'yes', zero: 'no', written: { one: 'Yes', zero: 'No' } });
  });

  it('a boolean column reads true as 1; the role map can name false (no) as 1 instead', async () => {
    const db = await audit({ url: url!, table: 'nr_test_words_bool' }, roles);
    expectSameAudit(db, file);
    expect(db.input.reading?.binary?.fixed).toEqual({ one: 'true', zero: 'false' });
    const text = await audit({ url: url!, table: 'nr_test_words_text' }, flipped);
    expect(text.input.reading?.binary?.fixed).toMatchObject({ one: 'no', zero: 'yes' });
    const [a, b] = [file.outcomes.fixed.logistic!, text.outcomes.fixed.logistic!];
    expect(Math.abs(a.icc - b.icc)).toBeLessThanOrEqual(1e-9);
    expect(Math.abs(a.intercept + b.intercept)).toBeLessThanOrEqual(1e-9);
  });
});
