import { beforeAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../../rules/index.js';
import type { AuditOptions } from '../../../src/audit.js';
import { audit } from '../../../src/audit.js';
import { problemRows } from '../../../src/problem-rows.js';
import type { Report } from '../../../src/report/types.js';
import { loadRoles } from '../../../src/roles/load-file.js';
import { detectFormat } from '../../../src/source/formats/detect.js';
import { INPUT_FORMATS } from '../../../src/source/formats/registry.js';
import { expectSameAudit } from './same.js';

// every fixture in fixtures/formats is repairs-delivery.csv in another format
// (scripts/make-format-fixtures.js): each must give the CSV's report
const CSV = 'fixtures/demo/repairs-delivery.csv';
const roles = loadRoles('fixtures/demo/repairs-delivery.roles.yaml', catalogue);
const cases: [string, string, AuditOptions?][] = [
  ['CSV with a UTF-8 byte-order mark', 'repairs-bom.csv'],
  ['gzip-compressed CSV', 'repairs.csv.gz'],
  ['TSV', 'repairs.tsv'],
  ['Parquet', 'repairs.parquet'],
  ['Arrow IPC file', 'repairs.arrow'],
  ['Arrow IPC stream', 'repairs.arrows'],
  ['Feather (Arrow IPC file), LZ4-frame compressed', 'repairs-lz4.feather'],
  ['Arrow IPC stream, zstd compressed', 'repairs-zstd.arrows'],
  ['JSON array', 'repairs.json'],
  ['NDJSON', 'repairs.ndjson'],
  ['Excel (first sheet)', 'repairs.xlsx'],
  ['Excel (--sheet jobs)', 'repairs.xlsx', { sheet: 'jobs' }],
  ['format given, not detected', 'repairs.tsv', { inputFormat: 'tsv' }],
];

describe('every delivery format gives the report of the same data as CSV', () => {
  let csv: Report;
  beforeAll(async () => {
    csv = await audit(CSV, roles);
  });

  it.each(cases)('%s (%s)', async (_, file, options) => {
    const path = `fixtures/formats/${file}`;
    const got = await audit(path, roles, options);
    expect(got.input.path).toBe(path);
    expectSameAudit(got, csv);
  });

  it('every format of the registry has a fixture here, detected as that format from its content', () => {
    const detected = cases
      .filter(([, , options]) => !options?.inputFormat)
      .map(([, file]) => detectFormat(`fixtures/formats/${file}`).format);
    expect([...new Set(detected)].sort()).toEqual([...INPUT_FORMATS].sort());
  });

  it('an Excel file gives the problem rows of the CSV (text cells that hold numbers read as numbers)', async () => {
    const rows = await problemRows(CSV, roles.roles, csv.findings);
    const xlsx = await problemRows('fixtures/formats/repairs.xlsx', roles.roles, csv.findings);
    expect(rows.rows.length).toBeGreaterThan(0);
    expect(xlsx).toEqual(rows);
  });

  it('Latin-1 with --encoding latin1 reads as the UTF-8 file does', async () => {
    const utf8 = await audit('fixtures/formats/accents.csv', roles);
    const latin1 = await audit('fixtures/formats/accents.latin1.csv', roles, { encoding: 'latin1' });
    expectSameAudit(latin1, utf8);
    expect(utf8.input.rowsRejected).toBe(0);
  });

  it('Latin-1 read as UTF-8 is not read silently: an input error naming the encoding and the option', async () => {
    await expect(audit('fixtures/formats/accents.latin1.csv', roles)).rejects.toThrow(
      /accents\.latin1\.csv: not UTF-8 text: \d+ of the \d+ lines .* looks like Latin-1: try --encoding latin1$/,
    );
  });

  it('an Excel sheet that is not there is an input error naming the sheets', async () => {
    await expect(audit('fixtures/formats/repairs.xlsx', roles, { sheet: 'nope' })).rejects.toThrow(
      /no worksheet named "nope" \(sheets: jobs, notes\)/,
    );
  });
});
