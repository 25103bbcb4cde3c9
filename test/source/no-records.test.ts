import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Float64, Table, tableToIPC, Utf8, vectorFromArray } from 'apache-arrow';
import ExcelJS from 'exceljs';
import { afterAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { audit } from '../../src/audit.js';
import { parseRoles } from '../../src/roles/load.js';

const dir = mkdtempSync(join(tmpdir(), 'nestready-empty-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const rolesText = 'group: school\nunit: pupil\noutcomes: [score]\n';
const roles = parseRoles(rolesText, 'roles.yaml', catalogue);
const file = (name: string, data: string | Uint8Array) => {
  const path = join(dir, name);
  writeFileSync(path, data);
  return path;
};

describe('a delivery with a header and no record is an input error saying so', () => {
  it.each([
    ['CSV', 'header.csv', 'school,pupil,score\n'],
    ['CSV without a final newline', 'header-nonl.csv', 'school,pupil,score'],
    ['TSV', 'header.tsv', 'school\tpupil\tscore\r\n'],
  ])('%s', async (_, name, text) => {
    await expect(audit(file(name, text), roles)).rejects.toThrow(new RegExp(`${name}: no records \\(a header and nothing under it\\)$`));
  });

  it('Arrow IPC with a schema and no batch', async () => {
    const empty = new Table({
      school: vectorFromArray([], new Utf8()),
      pupil: vectorFromArray([], new Utf8()),
      score: vectorFromArray([], new Float64()),
    });
    await expect(audit(file('header.arrow', tableToIPC(empty, 'file')), roles)).rejects.toThrow(/header\.arrow: no records/);
  });

  it('an Excel sheet with the header row only', async () => {
    const wb = new ExcelJS.Workbook();
    wb.addWorksheet('pupils').addRow(['school', 'pupil', 'score']);
    const path = join(dir, 'header.xlsx');
    await wb.xlsx.writeFile(path);
    await expect(audit(path, roles)).rejects.toThrow(/header\.xlsx: no records/);
  });

  it('every line under the header unreadable: no records, with the first reason', async () => {
    const path = file('ragged.csv', 'school,pupil,score\n1,a,2,9,9\n1,b,3,9,9\n');
    await expect(audit(path, roles)).rejects.toThrow(
      /ragged\.csv: no records: none of its 2 line\(s\) under the header could be read \(first: line 2, /,
    );
  });

  it('the CLI exits 2 with one line naming the file', () => {
    const csv = file('cli.csv', 'school,pupil,score\n');
    const yaml = file('roles.yaml', rolesText);
    const res = spawnSync(process.execPath, ['bin/nestready.js', 'audit', csv, '-r', yaml, '-q'], { encoding: 'utf8' });
    expect(res.status).toBe(2);
    expect(res.stdout).toBe('');
    expect(res.stderr.trim().split('\n')).toHaveLength(1);
    expect(res.stderr).toContain(`${csv}: no records`);
  });
});
