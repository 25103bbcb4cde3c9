import type { Roles } from '../../roles/types.js';
import type { DuckEngine } from '../engines/duckdb/engine.js';
import type { DuckHost } from '../engines/duckdb/host.js';
import type { DuckLayout } from '../engines/duckdb/layout.js';
import type { OpenOptions } from '../types.js';
import { delimiterHint } from './delimiter-hint.js';
import type { TextFiles } from './text-files.js';

/** An option of `OpenOptions` that only some formats read. */
export type FormatOption = 'encoding' | 'sheet';

/** What the readers DuckDB-WASM shares (CSV, staged tables) use of the engine. */
export type ReadHost = Pick<DuckHost, 'all' | 'run' | 'cleanup'>;

/** What a format's reader gets: the engine, the file and what detection found. */
export interface ReadContext<E extends ReadHost = DuckEngine> {
  engine: E;
  /** the delivery's first bytes and the copies the CSV reader may need */
  files: TextFiles;
  /** the file to read (a spooled stdin is a temp file) */
  file: string;
  /** what messages and the report call it */
  display: string;
  roles: Roles;
  /** missing tokens, a blank field included */
  missing: readonly string[];
  /** the file is gzip-compressed */
  gzip: boolean;
  /** CSV: the delimiter its first lines leave no doubt about */
  delimiter?: string;
  options: OpenOptions;
}

/**
 * One input format: how it is recognised and read. Detection (detect.ts), the CLI's
 * `--input-format` choices and help, and the README's table of formats are built from these
 * records, so a format is added here and nowhere else (its reader in a file of its own).
 */
export interface FormatSpec {
  name: string;
  /** how the README and `--help` name it */
  label: string;
  /** file name extensions, lower case, without the dot (after a `.gz`) */
  extensions: readonly string[];
  /** its magic numbers, for binary formats */
  magic?(head: Buffer): boolean;
  /** a look at a text file's start (BOM removed, leading blanks kept); tried in registry order, the last format is the fallback */
  looksLike?(text: string): boolean;
  /** may be gzip-compressed */
  gzip: boolean;
  /** the options it reads */
  options: readonly FormatOption[];
  /** hints read from the first bytes (after decompression) that spare the engine a guess */
  hints?(head: Buffer): { delimiter?: string };
  /** the README's "read by" cell */
  readBy: string;
  /** the README's notes cell */
  notes: string;
  /** open it in a DuckDB engine; the reader module is loaded only for its format (some are large) */
  read(ctx: ReadContext): Promise<DuckLayout>;
}

const startsJson = (text: string) => /^\s*[[{]/.test(text);
/** one object per line is NDJSON; an object spread over lines is a JSON document */
const firstLineParses = (text: string) => {
  try {
    JSON.parse(text.trimStart().split('\n', 1)[0].trim());
    return true;
  } catch {
    return false;
  }
};

const FORMAT_LIST = [
  {
    name: 'csv',
    label: 'CSV',
    extensions: ['csv', 'txt'],
    gzip: true,
    options: ['encoding'],
    hints: (head: Buffer) => ({ delimiter: delimiterHint(head.toString('latin1')) }),
    readBy: "DuckDB's CSV reader",
    notes:
      'delimiter and quoting sniffed; UTF-8 with or without a byte-order mark, or windows-1252 with `--encoding windows-1252` ' +
      '(alias `cp1252`; `latin1` is read as windows-1252, its superset)',
    read: async (ctx: ReadContext): Promise<DuckLayout> => (await import('./csv.js')).csvLayout(ctx, 'csv', ctx.delimiter),
  },
  {
    name: 'tsv',
    label: 'TSV',
    extensions: ['tsv', 'tab'],
    looksLike: (text: string) => {
      const line = text.split(/\r?\n/, 1)[0];
      return !startsJson(text) && line.includes('\t') && !line.includes(',');
    },
    gzip: true,
    options: ['encoding'],
    readBy: "DuckDB's CSV reader",
    notes: 'tab-delimited, read as CSV',
    read: async (ctx: ReadContext): Promise<DuckLayout> => (await import('./csv.js')).csvLayout(ctx, 'tsv', '\t'),
  },
  {
    name: 'parquet',
    label: 'Parquet',
    extensions: ['parquet', 'pq'],
    magic: (head: Buffer) => head.subarray(0, 4).toString('latin1') === 'PAR1',
    gzip: false,
    options: [],
    readBy: 'DuckDB (built in)',
    notes: 'numbers read as numbers, the rest as text',
    read: async (ctx: ReadContext): Promise<DuckLayout> => (await import('./parquet.js')).parquetLayout(ctx),
  },
  {
    name: 'arrow',
    label: 'Arrow IPC',
    extensions: ['arrow', 'arrows', 'feather', 'ipc'],
    // the file format's magic, or a stream's first continuation marker
    magic: (head: Buffer) =>
      head.subarray(0, 6).toString('latin1') === 'ARROW1' || (head.length >= 4 && head.readUInt32LE(0) === 0xffffffff),
    gzip: false,
    options: [],
    readBy: 'apache-arrow, batch by batch into DuckDB',
    notes: 'file or stream format (Feather v2 is the file format); LZ4-frame or zstd compressed bodies too',
    read: async (ctx: ReadContext): Promise<DuckLayout> => (await import('./arrow.js')).arrowLayout(ctx),
  },
  {
    name: 'json',
    label: 'JSON',
    extensions: ['json'],
    looksLike: (text: string) => startsJson(text) && !(text.trimStart().startsWith('{') && firstLineParses(text)),
    gzip: true,
    options: [],
    readBy: 'DuckDB (built in)',
    notes: 'an array of objects, one per record; a malformed document is an input error',
    read: async (ctx: ReadContext): Promise<DuckLayout> => (await import('./parquet.js')).jsonLayout(ctx, 'json'),
  },
  {
    name: 'ndjson',
    label: 'NDJSON',
    extensions: ['ndjson', 'jsonl'],
    looksLike: (text: string) => text.trimStart().startsWith('{') && firstLineParses(text),
    gzip: true,
    options: [],
    readBy: 'DuckDB (built in)',
    notes: 'one object per line',
    read: async (ctx: ReadContext): Promise<DuckLayout> => (await import('./parquet.js')).jsonLayout(ctx, 'ndjson'),
  },
  {
    name: 'xlsx',
    label: 'Excel .xlsx',
    extensions: ['xlsx'],
    magic: (head: Buffer) => head.subarray(0, 4).toString('latin1') === 'PK\x03\x04',
    gzip: false,
    options: ['sheet'],
    readBy: 'exceljs, streamed row by row into DuckDB',
    notes:
      "the sheet `--sheet NAME`, else the first whose header holds the role map's columns (named as the workbook names it); " +
      'its first row is the header; empty rows are not records',
    read: async (ctx: ReadContext): Promise<DuckLayout> => (await import('./xlsx.js')).xlsxLayout(ctx),
  },
] as const satisfies readonly FormatSpec[];

export type InputFormat = (typeof FORMAT_LIST)[number]['name'];

/** Every input format, in the order of the README table; the text look falls back to the first (CSV). */
export const FORMATS: readonly (FormatSpec & { name: InputFormat })[] = FORMAT_LIST;

export const INPUT_FORMATS: readonly InputFormat[] = FORMATS.map((f) => f.name);

export function formatSpec(name: InputFormat): FormatSpec {
  const spec = FORMATS.find((f) => f.name === name);
  if (!spec) throw new Error(`unknown input format ${name}`);
  return spec;
}

/** The CLI's words for the delivery argument: the formats it reads and which may be compressed. */
export function deliveryHelp(): string {
  const gz = FORMATS.filter((f) => f.gzip).map((f) => f.label);
  return `the data file (${FORMATS.map((f) => f.label).join(', ')}; ${gz.join('/')} may be .gz), or - for stdin`;
}
