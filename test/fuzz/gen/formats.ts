import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import fc from 'fast-check';
import type { Table } from './table.js';

/** How a CSV/TSV delivery is written: the damage a real one may carry. */
export interface TextDamage {
  delim: ',' | ';' | '\t';
  lineEnds: 'lf' | 'crlf' | 'mixed';
  bom: boolean;
  gzip: boolean;
  /** record indexes (mod the row count) with a field too few or too many */
  ragged: number[];
  nul: boolean;
  invalidUtf8: boolean;
}

export const textDamage: fc.Arbitrary<TextDamage> = fc.record({
  delim: fc.constantFrom(',', ';', '\t'),
  lineEnds: fc.constantFrom('lf', 'crlf', 'mixed'),
  bom: fc.boolean(),
  gzip: fc.boolean(),
  ragged: fc.oneof(
    { weight: 3, arbitrary: fc.constant<number[]>([]) },
    { weight: 1, arbitrary: fc.array(fc.integer({ min: -5, max: 5 }), { maxLength: 3 }) },
  ),
  nul: fc.oneof({ weight: 8, arbitrary: fc.constant(false) }, { weight: 1, arbitrary: fc.constant(true) }),
  invalidUtf8: fc.oneof({ weight: 8, arbitrary: fc.constant(false) }, { weight: 1, arbitrary: fc.constant(true) }),
});

function field(value: string, delim: string): string {
  return value.includes(delim) || /["\r\n]/.test(value) || value !== value.trim() ? `"${value.replace(/"/g, '""')}"` : value;
}

/** CSV/TSV bytes of a table with its damage; also how many records it holds (ragged ones included). */
export function delimited(t: Table, d: TextDamage, pick: (k: number) => number): Buffer {
  const lines = [t.header, ...t.rows].map((cells, i) => {
    let row = cells;
    if (i > 0 && d.ragged.some((r) => ((r % t.rows.length) + t.rows.length) % t.rows.length === i - 1)) {
      row = pick(i) % 2 ? [...cells, 'extra'] : cells.slice(0, -1);
    }
    return row.map((c) => field(c, d.delim)).join(d.delim);
  });
  const ends = lines.map((_, i) => (d.lineEnds === 'crlf' || (d.lineEnds === 'mixed' && pick(i) % 2) ? '\r\n' : '\n'));
  let text = lines.map((l, i) => l + ends[i]).join('');
  if (d.nul && t.rows.length) text = text.replace(/U(\d)/, 'U\u0000$1');
  let bytes = Buffer.from((d.bom ? '\uFEFF' : '') + text, 'utf8');
  if (d.invalidUtf8 && t.rows.length) {
    // a lone continuation byte and an overlong lead inside the first unit ID
    const at = bytes.indexOf('U', bytes.indexOf('\n'));
    if (at > 0) bytes = Buffer.concat([bytes.subarray(0, at + 1), Buffer.from([0xff, 0xc0]), bytes.subarray(at + 1)]);
  }
  return d.gzip ? gzipSync(bytes) : bytes;
}

/** JSON shapes: numbers where a cell reads as one (or all as strings), duplicate keys, mixed columns. */
export interface JsonDamage {
  numbers: 'typed' | 'strings' | 'mixed';
  duplicateKey: boolean;
  gzip: boolean;
}

export const jsonDamage: fc.Arbitrary<JsonDamage> = fc.record({
  numbers: fc.constantFrom('typed', 'strings', 'mixed'),
  duplicateKey: fc.boolean(),
  gzip: fc.boolean(),
});

function jsonValue(cell: string, numbers: JsonDamage['numbers'], k: number): string {
  // JSON's number grammar: no leading zeros ("007" stays a string)
  const isNumber = /^-?(0|[1-9]\d*)(\.\d+)?(e[-+]?\d+)?$/i.test(cell) && Number.isFinite(Number(cell));
  if (isNumber && (numbers === 'typed' || (numbers === 'mixed' && k % 2 === 0))) return cell;
  return JSON.stringify(cell);
}

/** A JSON array (`ndjson` false) or NDJSON text of the records; duplicate header names keep the first. */
export function jsonText(t: Table, d: JsonDamage, ndjson: boolean): Buffer {
  const records = t.rows.map((cells, k) => {
    const seen = new Set<string>();
    const members: string[] = [];
    t.header.forEach((name, i) => {
      if (seen.has(name)) return;
      seen.add(name);
      members.push(`${JSON.stringify(name)}:${jsonValue(cells[i], d.numbers, k)}`);
    });
    if (d.duplicateKey && k === t.rows.length - 1) members.push(`${JSON.stringify(t.header[2])}:1`);
    return `{${members.join(',')}}`;
  });
  const text = ndjson ? records.map((r) => `${r}\n`).join('') : `[${records.join(',\n')}]`;
  const bytes = Buffer.from(text, 'utf8');
  return d.gzip ? gzipSync(bytes) : bytes;
}

/** Write a table as .xlsx (exceljs) at `path`. */
export async function writeXlsx(t: Table, path: string): Promise<void> {
  const { default: ExcelJS } = await import('exceljs');
  const book = new ExcelJS.Workbook();
  const sheet = book.addWorksheet('data');
  // exceljs refuses no cell text; a formula-leading cell is written as text, as a sender's tool would
  sheet.addRow(t.header);
  for (const r of t.rows) sheet.addRow(r.map((c) => (/^-?\d+(\.\d+)?$/.test(c) ? Number(c) : c)));
  await book.xlsx.writeFile(path);
}

/** Write a table as Arrow IPC (apache-arrow), every column text; duplicate names keep the first. */
export async function writeArrow(t: Table, path: string): Promise<void> {
  const arrow = await import('apache-arrow');
  const columns: Record<string, string[]> = {};
  t.header.forEach((name, i) => {
    if (!(name in columns)) columns[name] = t.rows.map((r) => r[i]);
  });
  writeFileSync(path, arrow.tableToIPC(arrow.tableFromArrays(columns), 'file'));
}

/** Write a table as Parquet: its CSV read by DuckDB (all text, header kept) and COPY'd out. */
export async function writeParquet(t: Table, dir: string, path: string): Promise<void> {
  const csv = join(dir, 'parquet-source.csv');
  const plain: TextDamage = { delim: ',', lineEnds: 'lf', bom: false, gzip: false, ragged: [], nul: false, invalidUtf8: false };
  writeFileSync(
    csv,
    delimited(t, plain, () => 0),
  );
  const { DuckDBInstance } = await import('@duckdb/node-api');
  const db = await DuckDBInstance.create(':memory:', { threads: '1' });
  const con = await db.connect();
  try {
    const q = (s: string) => `'${s.replace(/'/g, "''")}'`;
    // DuckDB's CSV reader trims header names: the columns are named again as written (unless
    // duplicated, which DuckDB renames)
    const names =
      new Set(t.header).size === t.header.length ? ` AS t(${t.header.map((h) => `"${h.replace(/"/g, '""')}"`).join(', ')})` : '';
    await con.run(
      `COPY (SELECT * FROM read_csv(${q(csv)}, header = true, all_varchar = true, delim = ',', quote = '"', escape = '"')${names}) ` +
        `TO ${q(path)} (FORMAT parquet)`,
    );
  } finally {
    con.closeSync();
    db.closeSync();
  }
}
