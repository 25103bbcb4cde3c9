import { existsSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import ExcelJS from 'exceljs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../../rules/index.js';
import { audit } from '../../../src/audit.js';
import { renderReport } from '../../../src/report/render.js';
import type { Report } from '../../../src/report/types.js';
import { parseRoles } from '../../../src/roles/load.js';
import { workbookSheets } from '../../../src/source/formats/xlsx-sheets.js';
import { toCsv } from '../../helpers/delivery.js';
import { rezip } from '../../helpers/zip.js';
import { expectSameAudit } from './same.js';

const dir = mkdtempSync(join(tmpdir(), 'nestready-xlsx-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const roles = parseRoles('group: school\nunit: pupil\noutcomes: [score]\nlevel2: [size]\n', 'roles.yaml', catalogue);

// 12 schools of 4 pupils; the first 6 schools and the last 6 as two halves
const header = ['school', 'pupil', 'score', 'size'];
const rows: (string | number)[][] = [];
for (let g = 1; g <= 12; g++) for (let i = 0; i < 4; i++) rows.push([`S${g}`, `p${g}-${i}`, 40 + ((g * 7 + i * 5) % 17), 20 + g]);
const readme: (string | number)[][] = [
  ['About this workbook'],
  ['Sheet', 'What it holds', 'What it holds'], // a repeated cell: no table could be made of it as a header
  ['pupils', 'one row per pupil'],
];

/**
 * A workbook of named sheets (rows under each), written by exceljs; `python`: its relationships
 * written as a common Python writer writes them, with absolute targets ("/xl/worksheets/sheet1.xml"),
 * which exceljs's streaming reader does not match to the sheet names.
 */
async function workbook(name: string, sheets: [string, (string | number)[][]][], python = false): Promise<string> {
  const wb = new ExcelJS.Workbook();
  for (const [sheet, data] of sheets) {
    const ws = wb.addWorksheet(sheet);
    for (const r of data) ws.addRow(r);
  }
  const path = join(dir, name);
  await wb.xlsx.writeFile(path);
  if (python) {
    rezip(path, (entry, data) =>
      entry === 'xl/_rels/workbook.xml.rels' ? Buffer.from(data.toString('utf8').replace(/Target="(?!\/)/g, 'Target="/xl/')) : data,
    );
  }
  return path;
}

describe('Excel sheets', () => {
  let csv: Report;
  beforeAll(async () => {
    const path = join(dir, 'pupils.csv');
    writeFileSync(path, toCsv(rows.map((r) => Object.fromEntries(header.map((h, i) => [h, r[i]])))));
    csv = await audit(path, roles);
  });

  it('the sheets are named as the workbook names them, relationships with absolute targets too', async () => {
    const path = await workbook(
      'python.xlsx',
      [
        ['readme', readme],
        ['pupils', [header, ...rows]],
        ['schools', [['school', 'size']]],
      ],
      true,
    );
    expect(workbookSheets(path).map((s) => s.name)).toEqual(['readme', 'pupils', 'schools']);
    expectSameAudit(await audit(path, roles, { sheet: 'pupils' }), csv);
    await expect(audit(path, roles, { sheet: 'Sheet2' })).rejects.toThrow(
      /no worksheet named "Sheet2" \(sheets: readme, pupils, schools\)$/,
    );
  });

  it("a read-me first sheet: the sheet holding the role map's columns is read, and the report says so", async () => {
    const path = await workbook(
      'readme-first.xlsx',
      [
        ['readme', readme],
        ['pupils', [header, ...rows]],
      ],
      true,
    );
    const got = await audit(path, roles);
    expectSameAudit(got, csv);
    expect(got.input.notes).toEqual([`sheet "pupils" read: the first whose header holds the role map's columns (sheets: readme, pupils)`]);
    // every report prints the note beside the input line
    for (const format of ['text', 'md', 'html'] as const) {
      const out = await renderReport(got, format, { color: 0, failOn: 'blocker', withPlotData: false });
      expect(out).toMatch(/sheet (&quot;|&#34;|\\?")pupils\1 read/);
    }
  });

  it("no sheet holds the columns: the header check lists the nearest sheet's header, no internal error", async () => {
    const renamed = [['school', 'pupil', 'points', 'size'], ...rows];
    const path = await workbook('no-match.xlsx', [
      ['readme', readme],
      ['pupils', renamed],
    ]);
    await expect(audit(path, roles)).rejects.toThrow(
      /column "score" is not in .*no-match\.xlsx; its header is: school, pupil, points, size$/,
    );
  });

  it('other sheets with the same header: a note that the data may be split over sheets', async () => {
    const path = await workbook('split.xlsx', [
      ['first half', [header, ...rows.slice(0, 24)]],
      ['second half', [header, ...rows.slice(24)]],
      ['notes', [['written by hand']]],
    ]);
    const got = await audit(path, roles);
    expect(got.input.rows).toBe(24);
    expect(got.input.notes).toEqual([
      'sheet(s) "second half" have the same header as "first half": the data may be split over sheets, and only "first half" was read ' +
        '(--sheet NAME reads another)',
    ]);
  });

  it('one data sheet first: no note, as before', async () => {
    const path = await workbook(
      'plain.xlsx',
      [
        ['pupils', [header, ...rows]],
        ['notes', [['written by hand']]],
      ],
      true,
    );
    const got = await audit(path, roles);
    expectSameAudit(got, csv);
    expect(got.input.notes).toBeUndefined();
  });

  it('no sheet is spooled to a temp file', async () => {
    const path = await workbook(
      'spooled.xlsx',
      [
        ['readme', readme],
        ['pupils', [header, ...rows]],
      ],
      true,
    );
    const tmp = readdirSync(tmpdir()).filter((f) => f.startsWith('tmp-'));
    await audit(path, roles);
    const left = readdirSync(tmpdir()).filter((f) => f.startsWith('tmp-') && !tmp.includes(f) && existsSync(join(tmpdir(), f)));
    expect(left).toEqual([]);
  });
});
