import { InputError } from '../../../errors.js';
import { delimiterHint } from '../../formats/delimiter-hint.js';

/** The formats the page reads (see README, "The sender's page"). */
export type PageFormat = 'csv' | 'tsv' | 'json' | 'ndjson';

/** Binary formats the page decodes itself (parquet.ts), recognised before any text is looked at. */
export type PageBinaryFormat = 'parquet' | 'arrow';

const BINARY: { format: PageBinaryFormat; magic: (b: Uint8Array) => boolean; extensions: string[] }[] = [
  { format: 'parquet', magic: (b) => latin1(b, 0, 4) === 'PAR1', extensions: ['parquet', 'pq'] },
  {
    format: 'arrow',
    magic: (b) => latin1(b, 0, 6) === 'ARROW1' || (b.length >= 4 && b[0] === 0xff && b[1] === 0xff && b[2] === 0xff && b[3] === 0xff),
    extensions: ['arrow', 'arrows', 'feather', 'ipc'],
  },
];

/** Formats the command line reads that the page cannot: the Excel reader reads files from disk. */
const ELSEWHERE: { name: string; magic: (b: Uint8Array) => boolean; extensions: string[] }[] = [
  { name: 'Excel', magic: (b) => latin1(b, 0, 4) === 'PK\x03\x04', extensions: ['xlsx'] },
];

function extension(name: string): string {
  const lower = name.toLowerCase().replace(/\.gz$/, '');
  return lower.includes('.') ? lower.slice(lower.lastIndexOf('.') + 1) : '';
}

/**
 * A binary format the page decodes itself, by its magic number, else by the name's extension
 * (as formats/detect.ts decides): such a file is never looked at as text (line ends untouched).
 */
export function binaryPicked(name: string, bytes: Uint8Array): PageBinaryFormat | undefined {
  const byMagic = BINARY.find((f) => f.magic(bytes));
  if (byMagic || ELSEWHERE.some((f) => f.magic(bytes))) return byMagic?.format;
  return BINARY.find((f) => f.extensions.includes(extension(name)))?.format;
}

const EXTENSIONS: Record<string, PageFormat> = {
  csv: 'csv',
  txt: 'csv',
  tsv: 'tsv',
  tab: 'tsv',
  json: 'json',
  ndjson: 'ndjson',
  jsonl: 'ndjson',
};

function latin1(b: Uint8Array, start: number, end: number): string {
  return String.fromCharCode(...b.subarray(start, end));
}

export interface PageDetected {
  format: PageFormat;
  delimiter?: string;
}

/**
 * The format of a picked file, as the command line decides it (formats/detect.ts): magic
 * numbers, then the name's extension (after a .gz), then a look at the text; `head` is the
 * file's first bytes with gzip undone.
 *
 * @throws InputError for a format the page cannot read
 */
export function detectPicked(name: string, head: Uint8Array): PageDetected {
  const ext = extension(name);
  const other = ELSEWHERE.find((f) => f.magic(head)) ?? ELSEWHERE.find((f) => f.extensions.includes(ext));
  if (other) {
    throw new InputError(
      `${name}: ${other.name} files cannot be read in this page; save the delivery as CSV (or JSON, Parquet, Arrow) and pick that`,
    );
  }
  let text = new TextDecoder().decode(head.subarray(0, 65536));
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  const format = EXTENSIONS[ext] ?? textKind(text);
  const delimiter = format === 'csv' ? delimiterHint(latin1Text(head.subarray(0, 65536))) : undefined;
  return { format, ...(delimiter !== undefined && { delimiter }) };
}

function latin1Text(b: Uint8Array): string {
  let s = '';
  for (let i = 0; i < b.length; i += 8192) s += latin1(b, i, Math.min(b.length, i + 8192));
  return s;
}

/** The look at a text's start, in the order of formats/registry.ts (TSV, JSON, NDJSON, else CSV). */
function textKind(text: string): PageFormat {
  const json = /^\s*[[{]/.test(text);
  const line = text.split(/\r?\n/, 1)[0];
  if (!json && line.includes('\t') && !line.includes(',')) return 'tsv';
  if (!json) return 'csv';
  let firstLine = false;
  try {
    JSON.parse(text.trimStart().split('\n', 1)[0].trim());
    firstLine = true;
  } catch {}
  return text.trimStart().startsWith('{') && firstLine ? 'ndjson' : 'json';
}
