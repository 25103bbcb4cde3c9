import { closeSync, openSync, readSync } from 'node:fs';
import { constants, gunzipSync } from 'node:zlib';
import { InputError } from '../errors.js';
import type { InputFormat } from './types.js';

export interface Detected {
  format: InputFormat;
  /** the file is gzip-compressed (CSV/TSV/JSON only) */
  gzip: boolean;
  /** CSV: the delimiter when the first lines leave no doubt (see delimiterHint) */
  delimiter?: string;
}

const DELIMITERS = [',', ';', '\t', '|'];

/**
 * The delimiter of a delimited text when its first two lines leave no doubt: exactly one of
 * , ; tab | appears in the header, as often in the next line. DuckDB's sniffer then tries that
 * delimiter only (its guess of quotes, line ends and types is unchanged): 20-30 ms less of every
 * audit of a large file. Anything less plain (a quoted delimiter, one line) is left to the sniffer.
 */
export function delimiterHint(text: string): string | undefined {
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/, 3);
  if (lines.length < 3) return undefined; // the second line is not known to be whole
  const count = (line: string, d: string) => line.split(d).length - 1;
  const inHeader = DELIMITERS.filter((d) => count(lines[0], d) > 0);
  if (inHeader.length !== 1) return undefined;
  const [d] = inHeader;
  return count(lines[1], d) === count(lines[0], d) ? d : undefined;
}

const BY_EXTENSION: Record<string, InputFormat> = {
  csv: 'csv',
  txt: 'csv',
  tsv: 'tsv',
  tab: 'tsv',
  parquet: 'parquet',
  pq: 'parquet',
  arrow: 'arrow',
  arrows: 'arrow',
  feather: 'arrow',
  ipc: 'arrow',
  json: 'json',
  ndjson: 'ndjson',
  jsonl: 'ndjson',
  xlsx: 'xlsx',
};

/** The first bytes of a file (at most `n`). */
function head(path: string, n: number): Buffer {
  const fd = openSync(path, 'r');
  try {
    const buf = Buffer.alloc(n);
    const got = readSync(fd, buf, 0, n, 0);
    return buf.subarray(0, got);
  } finally {
    closeSync(fd);
  }
}

/** The format a file's bytes show: magic numbers for the binary formats, a look at the text for the rest. */
function byContent(bytes: Buffer): InputFormat | null {
  if (bytes.subarray(0, 4).toString('latin1') === 'PAR1') return 'parquet';
  if (bytes.subarray(0, 6).toString('latin1') === 'ARROW1') return 'arrow';
  if (bytes.length >= 4 && bytes.readUInt32LE(0) === 0xffffffff) return 'arrow'; // IPC stream
  if (bytes.subarray(0, 4).toString('latin1') === 'PK\x03\x04') return 'xlsx';
  return null;
}

function textKind(bytes: Buffer): InputFormat {
  let text = bytes.toString('utf8');
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  const trimmed = text.trimStart();
  if (trimmed.startsWith('[')) return 'json';
  if (trimmed.startsWith('{')) {
    // one object per line is NDJSON; an object spread over lines is a JSON document
    const first = trimmed.split('\n', 1)[0].trim();
    try {
      JSON.parse(first);
      return 'ndjson';
    } catch {
      return 'json';
    }
  }
  const line = text.split(/\r?\n/, 1)[0];
  return line.includes('\t') && !line.includes(',') ? 'tsv' : 'csv';
}

/**
 * Which format a delivery is in: the user's word, else the binary formats' magic numbers,
 * else the file name's extension (after a .gz), else a look at the text.
 */
export function detectFormat(path: string, given?: InputFormat): Detected {
  let bytes = head(path, 65536);
  const gzip = bytes.length >= 2 && bytes[0] === 0x1f && bytes[1] === 0x8b;
  if (gzip) {
    try {
      bytes = gunzipSync(bytes, { finishFlush: constants.Z_SYNC_FLUSH });
    } catch (e) {
      throw new InputError(`${path}: not a readable gzip file (${(e as Error).message})`);
    }
  }
  const name = path.toLowerCase().replace(/\.gz$/, '');
  const ext = name.includes('.') ? name.slice(name.lastIndexOf('.') + 1) : '';
  const format = given ?? byContent(bytes) ?? BY_EXTENSION[ext] ?? textKind(bytes);
  if (gzip && !['csv', 'tsv', 'json', 'ndjson'].includes(format)) {
    throw new InputError(`${path}: a gzip-compressed ${format} file cannot be read; decompress it first`);
  }
  const delimiter = format === 'csv' ? delimiterHint(bytes.toString('latin1')) : undefined;
  return { format, gzip, ...(delimiter !== undefined && { delimiter }) };
}
