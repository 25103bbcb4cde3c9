import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, watch, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import ExcelJS from 'exceljs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../../rules/index.js';
import { audit } from '../../../src/audit.js';
import { parseRoles } from '../../../src/roles/load.js';
import { openWorkbook } from '../../../src/source/formats/xlsx-book.js';
import { toCsv } from '../../helpers/delivery.js';
import { rezip } from '../../helpers/zip.js';
import { expectSameAudit } from './same.js';

const dir = mkdtempSync(join(tmpdir(), 'nestready-xlsx-book-'));
// a private temp folder: whatever the reader spools would land here
const tmp = join(dir, 'tmp');
mkdirSync(tmp);
const savedTmp = process.env.TMPDIR;
afterAll(() => {
  if (savedTmp === undefined) delete process.env.TMPDIR;
  else process.env.TMPDIR = savedTmp;
  rmSync(dir, { recursive: true, force: true });
});

const roles = parseRoles('group: school\nunit: pupil\noutcomes: [score]\n', 'roles.yaml', catalogue);
const header = ['school', 'pupil', 'score', 'note'];
const rows: (string | number)[][] = [];
for (let g = 1; g <= 8; g++) for (let i = 0; i < 5; i++) rows.push([`S${g}`, `p${g}-${i}`, 40 + ((g * 7 + i * 5) % 17), `say "hi" ${i}`]);

/** exceljs's workbook of one sheet, its zip entries rewritten in the order `order` gives. */
async function workbook(name: string, order: (names: string[]) => string[]): Promise<string> {
  const wb = new ExcelJS.Workbook();
  const ws = wb.addWorksheet('pupils');
  for (const r of [header, ...rows]) ws.addRow(r);
  const path = join(dir, name);
  await wb.xlsx.writeFile(path);
  rezip(path, undefined, order);
  return path;
}

describe('Excel workbooks read through the zip directory', () => {
  let csvPath: string;
  beforeAll(() => {
    process.env.TMPDIR = tmp;
    csvPath = join(dir, 'pupils.csv');
    writeFileSync(csvPath, toCsv(rows.map((r) => Object.fromEntries(header.map((h, i) => [h, r[i]])))));
  });

  it('worksheets before workbook.xml and the shared strings (the order that made sheets wait in temp files)', async () => {
    const last = ['xl/sharedStrings.xml', 'xl/styles.xml', 'xl/workbook.xml', 'xl/_rels/workbook.xml.rels'];
    const path = await workbook('late-book.xlsx', (names) => [...names.filter((n) => !last.includes(n)), ...last]);
    const created: string[] = [];
    // the engine's own spill folder (nestready-spill-*) is made and removed by the engine
    const watcher = watch(tmp, (_, f) => !String(f).startsWith('nestready-') && created.push(String(f)));
    const got = await audit(path, roles);
    const want = await audit(csvPath, roles);
    watcher.close();
    expectSameAudit(got, want);
    // not one file made, let alone left (the CSV's audit above gives the watcher time to report)
    expect(created).toEqual([]);
    expect(readdirSync(tmp)).toEqual([]);
  });

  it('the same rows on every read, in any entry order (the streamed zip walk lost its last entries now and then)', async () => {
    const path = await workbook('reversed.xlsx', (names) => [...names].reverse());
    const read = async () => {
      const book = await openWorkbook(path);
      if (!book) throw new Error('not opened');
      const out: unknown[] = [];
      for await (const row of book.rows(book.sheets[0])) out.push(row.values);
      return JSON.stringify({ sheets: book.sheets, out });
    };
    const first = await read();
    expect(JSON.parse(first).out).toHaveLength(rows.length + 1);
    expect(JSON.parse(first).sheets).toEqual([{ name: 'pupils', path: 'xl/worksheets/sheet1.xml' }]);
    const again = await Promise.all(Array.from({ length: 20 }, read));
    expect(again.every((r) => r === first)).toBe(true);
    expect(readdirSync(tmp)).toEqual([]);
  });

  it('a workbook cut short: one line naming the file, exit 2 (InputError)', async () => {
    const whole = readFileSync(await workbook('whole.xlsx', (n) => n));
    const cut = join(dir, 'cut.xlsx');
    writeFileSync(cut, whole.subarray(0, whole.length - 40));
    await expect(audit(cut, roles)).rejects.toThrow(/^.*cut\.xlsx: cannot read as Excel \.xlsx \(not a zip archive, or one cut short\)$/);
  });
});
