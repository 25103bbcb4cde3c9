#!/usr/bin/env node
// @ts-check
// Regenerate fixtures/formats/ from fixtures/demo/repairs-delivery.csv: the same delivery in every
// format nestready reads, plus small cases for encodings and unreadable lines. The parity tests
// (test/source/formats/) audit each one and compare with the audit of the CSV.
//
//   node scripts/make-format-fixtures.js
//
// Typed formats (Parquet, Arrow, JSON, NDJSON) hold the columns as DuckDB types the CSV (numbers
// as numbers, text as text, blank fields as null); Excel holds numbers as numbers and the rest as
// text, as a spreadsheet export would.

import { mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';
import { DuckDBInstance } from '@duckdb/node-api';
import {
  CompressionType,
  compressionRegistry,
  Float64,
  RecordBatchFileWriter,
  RecordBatchStreamWriter,
  Table,
  tableFromIPC,
  tableToIPC,
  Utf8,
  vectorFromArray,
} from 'apache-arrow';
import ExcelJS from 'exceljs';
import { decompress as zstdDecompress } from 'fzstd';
import lz4 from 'lz4js';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const demo = join(root, 'fixtures/demo/repairs-delivery.csv');
const out = join(root, 'fixtures/formats');
mkdirSync(out, { recursive: true });
const csvText = readFileSync(demo, 'utf8');
/** @param {string} s */
const sql = (s) => `'${s.replace(/'/g, "''")}'`;

// ---- text variants ----------------------------------------------------------------------
writeFileSync(join(out, 'repairs-bom.csv'), `\ufeff${csvText}`);
writeFileSync(join(out, 'repairs.csv.gz'), gzipSync(Buffer.from(csvText, 'utf8'), { level: 9 }));

/**
 * Split one CSV line into fields (the demo quotes only simple fields, never newlines).
 * @param {string} line
 */
function fields(line) {
  const outFields = [];
  let i = 0;
  while (i <= line.length) {
    if (line[i] === '"') {
      let j = i + 1;
      let v = '';
      while (true) {
        if (line[j] === '"' && line[j + 1] === '"') {
          v += '"';
          j += 2;
        } else if (line[j] === '"') break;
        else v += line[j++];
      }
      outFields.push(v);
      i = j + 2;
    } else {
      const j = line.indexOf(',', i);
      outFields.push(line.slice(i, j < 0 ? line.length : j));
      i = j < 0 ? line.length + 1 : j + 1;
    }
  }
  return outFields;
}
const lines = csvText.replace(/\n$/, '').split('\n');
const table = lines.map(fields);
/** @param {string} v */
const tsvField = (v) => (/[\t"\n]|^\s|\s$/.test(v) ? `"${v.replace(/"/g, '""')}"` : v);
writeFileSync(join(out, 'repairs.tsv'), `${table.map((r) => r.map(tsvField).join('\t')).join('\n')}\n`);

// a subset with accented network names, in UTF-8 and in Latin-1
/** @type {Record<string, string>} */
const accents = { amber: 'ámbar', birch: 'bïrch', cobalt: 'cobalt', dune: 'düne', ember: 'émber', fern: 'fougère' };
const accented = lines
  .slice(0, 601)
  .map((l, i) => (i === 0 ? l : l.replace(/,(amber|birch|cobalt|dune|ember|fern),/, (_, n) => `,${accents[n]},`)));
writeFileSync(join(out, 'accents.csv'), `${accented.join('\n')}\n`);
writeFileSync(join(out, 'accents.latin1.csv'), Buffer.from(`${accented.join('\n')}\n`, 'latin1'));

// an export from a Windows spreadsheet: windows-1252 with CRLF line ends, and the same in UTF-8;
// ’ € – are bytes 0x80-0x9F there, which Latin-1 leaves as control characters
/** @type {Record<string, string>} */
const win = { amber: 'ámber’s', birch: 'birch – north', dune: 'düne €', fern: 'fougère' };
/** @type {Record<string, string>} */
const winKinds = { clothing: 'children’s clothing', lamp: 'lamp – desk', other: 'other (€ 5 flat)' };
const winLines = lines
  .slice(0, 1201)
  .map((l, i) =>
    i === 0
      ? l
      : l.replace(/,(amber|birch|dune|fern),/, (_, n) => `,${win[n]},`).replace(/,(clothing|lamp|other),/, (_, k) => `,${winKinds[k]},`),
  );
/** @type {Record<string, number>} the windows-1252 bytes of the characters above that Latin-1 lacks */
const cp1252 = { '€': 0x80, '’': 0x92, '–': 0x96 };
/** @param {string} text */
const toCp1252 = (text) =>
  Buffer.from(
    [...text].map((c) => {
      const code = cp1252[c] ?? c.charCodeAt(0);
      if (code > 0xff) throw new Error(`no windows-1252 byte for ${c}`);
      return code;
    }),
  );
writeFileSync(join(out, 'windows.csv'), `${winLines.join('\r\n')}\r\n`);
writeFileSync(join(out, 'windows.cp1252.csv'), toCp1252(`${winLines.join('\r\n')}\r\n`));

// unreadable lines: 60 records (one of them with a quoted field) with broken lines between them
const quoted = lines.find((l) => l.includes('"W-014 "'));
const records = [quoted, ...lines.slice(1, 60)];
const notUtf8 = Buffer.concat([
  Buffer.from('J900004,W-001,amber,31.5,1,lamp'),
  Buffer.from([0xff, 0xfe]),
  Buffer.from(',2.0,1,weekly,9,2022'),
]);
/** @type {[number, string | Buffer][]} */
const brokenLines = [
  [11, 'J900001,W-001,amber,31.5,1,lamp'], // file line 12: too few fields
  [21, 'J900002,W-001,amber,31.5,1,lamp,2.0,1,weekly,9,2022,surplus'], // line 22: too many fields
  [31, 'J900003,W-001,amber,31.5,1,"lamp"x,2.0,1,weekly,9,2022'], // line 32: text after a closing quote
  [41, notUtf8], // line 42: not UTF-8
];
const parts = [Buffer.from(`${lines[0]}\n`)];
let at = 1; // file line of the next record
for (const [i, r] of records.entries()) {
  for (const [where, bad] of brokenLines)
    if (where === at) {
      parts.push(Buffer.concat([typeof bad === 'string' ? Buffer.from(bad) : bad, Buffer.from('\n')]));
      at++;
    }
  parts.push(Buffer.from(`${r}\n`));
  at++;
  if (i === records.length - 1) break;
}
writeFileSync(join(out, 'rejects.csv'), Buffer.concat(parts));
// a quote never closed: the rest of the file becomes one (rejected) record, from line 6 on
writeFileSync(
  join(out, 'runaway-quote.csv'),
  [lines[0], quoted, ...lines.slice(1, 4)].join('\n') +
    '\n' +
    'J900005,W-001,amber,31.5,1,"lamp,2.0,1,weekly,9,2022\n' +
    lines.slice(4, 10).join('\n') +
    '\n',
);

// ---- typed formats, through DuckDB's own typing of the CSV ----------------------------------
const inst = await DuckDBInstance.create(':memory:');
const con = await inst.connect();
await con.run(`CREATE TABLE d AS SELECT * FROM read_csv(${sql(demo)}, header = true)`);
for (const f of ['repairs.parquet', 'repairs.json', 'repairs.ndjson']) rmSync(join(out, f), { force: true });
await con.run(`COPY d TO ${sql(join(out, 'repairs.parquet'))} (FORMAT parquet)`);
await con.run(`COPY d TO ${sql(join(out, 'repairs.json'))} (FORMAT json, ARRAY true)`);
await con.run(`COPY d TO ${sql(join(out, 'repairs.ndjson'))} (FORMAT json)`);

const types = (await con.runAndReadAll('DESCRIBE d')).getRowObjectsJS();
const columns = (await con.runAndReadAll('SELECT * FROM d')).getColumnsObjectJS();
/** @type {Record<string, import('apache-arrow').Vector>} */
const vectors = {};
for (const { column_name: name, column_type: type } of types) {
  const numeric = /INT|DOUBLE|FLOAT|DECIMAL/.test(String(type));
  const values = columns[String(name)].map((v) => (v === null ? null : numeric ? Number(v) : String(v)));
  vectors[String(name)] = vectorFromArray(values, numeric ? new Float64() : new Utf8());
}
writeFileSync(join(out, 'repairs.arrow'), tableToIPC(new Table(vectors), 'file'));
writeFileSync(join(out, 'repairs.arrows'), tableToIPC(new Table(vectors), 'stream'));

// ---- compressed Arrow: LZ4 frame (the Feather writers' default) and zstd ----------------------
/**
 * A zstd frame (RFC 8878) of raw and RLE blocks only: fzstd decompresses but cannot compress,
 * and Node 20's zlib has no zstd. Runs of 8 or more equal bytes become RLE blocks, so validity
 * bitmaps and repeated values shrink and the writer keeps the compressed buffer; other bytes
 * are stored in raw blocks. A valid frame any zstd decoder reads, though not what zstd writes.
 * @param {Uint8Array} data
 */
function zstdRawFrame(data) {
  /** @type {number[]} */
  const bytes = [0x28, 0xb5, 0x2f, 0xfd, 0xa0]; // magic; single segment, 4-byte content size
  for (let k = 0; k < 4; k++) bytes.push((data.length >>> (8 * k)) & 0xff);
  /** @type {[number, number, number][]} block type (0 raw, 1 RLE), start, length */
  const blocks = [];
  const MAX = 1 << 17; // a block holds at most 128 KiB
  let raw = 0;
  let i = 0;
  while (i < data.length) {
    let j = i;
    while (j < data.length && data[j] === data[i] && j - i < MAX) j++;
    if (j - i >= 8) {
      for (let r = raw; r < i; r += MAX) blocks.push([0, r, Math.min(MAX, i - r)]);
      blocks.push([1, i, j - i]);
      raw = j;
    }
    i = j;
  }
  for (let r = raw; r < data.length; r += MAX) blocks.push([0, r, Math.min(MAX, data.length - r)]);
  if (!blocks.length) blocks.push([0, 0, 0]);
  blocks.forEach(([type, start, length], b) => {
    const header = (length << 3) | (type << 1) | (b === blocks.length - 1 ? 1 : 0);
    bytes.push(header & 0xff, (header >>> 8) & 0xff, (header >>> 16) & 0xff);
    if (type === 1) bytes.push(data[start]);
    else for (let k = start; k < start + length; k++) bytes.push(data[k]);
  });
  return Uint8Array.from(bytes);
}
// decoded buffers copied to offset 0, as src/source/formats/arrow-codecs.ts does (8-byte alignment)
compressionRegistry.set(CompressionType.LZ4_FRAME, { encode: (d) => lz4.compress(d), decode: (d) => lz4.decompress(d).slice() });
compressionRegistry.set(CompressionType.ZSTD, { encode: zstdRawFrame, decode: (d) => zstdDecompress(d).slice() });
const plain = new Table(vectors);
// three record batches, so that more than one compressed body is read
const batched = new Table([plain.slice(0, 400), plain.slice(400, 800), plain.slice(800)].flatMap((t) => t.batches));
/** @type {[string, 'file' | 'stream', CompressionType][]} */
const compressed = [
  ['repairs-lz4.feather', 'file', CompressionType.LZ4_FRAME],
  ['repairs-zstd.arrows', 'stream', CompressionType.ZSTD],
];
for (const [name, kind, compressionType] of compressed) {
  const Writer = kind === 'file' ? RecordBatchFileWriter : RecordBatchStreamWriter;
  const bytes = new Writer({ compressionType }).writeAll(batched).toUint8Array(true);
  // read back with the decoders: the same values as the plain table
  const back = tableFromIPC(bytes);
  if (back.numRows !== plain.numRows || JSON.stringify(back.toArray()) !== JSON.stringify(plain.toArray())) {
    throw new Error(`${name}: does not read back as written`);
  }
  writeFileSync(join(out, name), bytes);
}
con.closeSync();
inst.closeSync();

// ---- Excel: the data on the first sheet, a notes sheet after it -----------------------------
const wb = new ExcelJS.Workbook();
wb.creator = 'nestready fixtures';
wb.created = new Date(Date.UTC(2024, 5, 11));
wb.modified = new Date(Date.UTC(2024, 5, 11));
const ws = wb.addWorksheet('jobs');
/** @param {string} v */
const canonicalNumber = (v) => /^-?\d+(\.\d+)?$/.test(v) && String(Number(v)) === v;
for (const [i, r] of table.entries()) ws.addRow(r.map((v) => (i > 0 && canonicalNumber(v) ? Number(v) : v === '' ? null : v)));
wb.addWorksheet('notes').addRow(['repairs-delivery.csv as a workbook (fixtures/formats, scripts/make-format-fixtures.js)']);
await wb.xlsx.writeFile(join(out, 'repairs.xlsx'));

process.stdout.write(`fixtures written to ${out}\n`);
