import type { Roles } from '../../../roles/types.js';
import { isNumberKind } from '../../../roles/types.js';
import type { Storage } from '../../sql.js';
import { literal } from '../../sql.js';
import { splitNullTokens, withNullTokens } from './csv-null-tokens.js';

/** The dialect the sniffer found, passed back so that no later read sniffs again. */
export interface CsvDialect {
  delim: string;
  /** '' for none */
  quote: string;
  escape: string;
  /** as sniff_csv writes it: '\n', '\r\n' */
  newline: string;
  skip: number;
}

/** How the CSV reader is told what the sniffer cannot guess (or the user said). */
export interface CsvOptions {
  /** field delimiter; sniffed when absent */
  delim?: string;
  /** 'utf-8' (default; a byte-order mark is skipped) or 'latin-1' */
  encoding?: 'utf-8' | 'latin-1';
  /** 'gzip' for a compressed file whose name does not end in .gz (stdin) */
  compression?: 'gzip';
  /**
   * The sniffed dialect: reads then skip DuckDB's auto-detection (every read_csv that binds
   * would otherwise sniff the file again, a tenth of a second each).
   */
  dialect?: CsvDialect;
  /** ',' for numbers written with a decimal comma (the fields then separated by something else) */
  decimalSeparator?: ',';
  /** quote and escape for the sniff to keep to (it guesses the rest) */
  quoting?: { quote: string; escape: string };
}

function csvOptions(o: CsvOptions): string {
  const parts = [];
  const d = o.dialect;
  if (d) {
    parts.push('auto_detect = false', `delim = ${literal(d.delim)}`, `quote = ${literal(d.quote)}`, `escape = ${literal(d.escape)}`);
    parts.push(`new_line = ${literal(d.newline)}`, `skip = ${Math.max(0, Math.floor(d.skip))}`);
  } else {
    if (o.delim !== undefined) parts.push(`delim = ${literal(o.delim)}`);
    if (o.quoting) parts.push(`quote = ${literal(o.quoting.quote)}`, `escape = ${literal(o.quoting.escape)}`);
  }
  if (o.encoding && o.encoding !== 'utf-8') parts.push(`encoding = ${literal(o.encoding)}`);
  if (o.compression) parts.push(`compression = ${literal(o.compression)}`);
  if (o.decimalSeparator) parts.push(`decimal_separator = ${literal(o.decimalSeparator)}`);
  return parts.map((p) => `, ${p}`).join('');
}

/**
 * read_csv over the delivery. 'sniff': let DuckDB guess the dialect and types from a sample (for
 * the header and type hints); a map: text or DOUBLE per column, with the sniffed dialect. Missing
 * tokens are read as NULL by the reader itself (nullstr), which is far cheaper than a CASE per cell;
 * the few it refuses (a quote or the delimiter in them: csv-null-tokens.ts) get the CASE, on text columns.
 * `sample`: for a read of the first rows only, which logs no rejects (DuckDB 1.5 fails inside a
 * limited scan that stores them).
 */
export function readCsv(
  path: string,
  missing: readonly string[],
  storage: Map<string, Storage> | 'sniff',
  options: CsvOptions = {},
  sample = false,
): string {
  const given = csvOptions(storage === 'sniff' ? { ...options, dialect: undefined } : options);
  // a token with a quote or the delimiter in it cannot be the reader's: matched after the read
  const { reader, after } = splitNullTokens(missing, options.dialect?.delim ?? options.delim);
  const nullstr = `nullstr = [${reader.map(literal).join(', ')}]${given}`;
  if (storage === 'sniff') return `read_csv(${literal(path)}, header = true, ${nullstr}, ignore_errors = true)`;
  const types = [...storage].map(([c, s]) => `${literal(c)}: '${s === 'double' ? 'DOUBLE' : 'VARCHAR'}'`).join(', ');
  // with auto-detection off the columns are given in full, in order (`columns`), not as hints
  const typed = options.dialect ? `columns = {${types}}` : `types = {${types}}`;
  const buffer = `buffer_size = ${CSV_BUFFER_BYTES}`;
  const read = sample
    ? `read_csv(${literal(path)}, header = true, ${nullstr}, ${typed}, ${buffer}, ignore_errors = true)`
    : `read_csv(${literal(path)}, header = true, ${nullstr}, ${typed}, ${buffer}, ` +
      `store_rejects = true, rejects_table = 'nr_rejects', rejects_scan = 'nr_scans')`;
  return withNullTokens(read, storage, after);
}

/**
 * The CSV reader's buffer per scan. DuckDB's default (32 MiB) holds several buffers in flight per
 * thread; 4 MiB (twice the longest line it accepts by default) lowers the profiling pass's peak
 * memory and is no slower (docs/performance.md has the figures).
 */
export const CSV_BUFFER_BYTES = 4 * 2 ** 20;

export const NUMERIC_TYPES = /^(TINYINT|SMALLINT|INTEGER|BIGINT|HUGEINT|UTINYINT|USMALLINT|UINTEGER|UBIGINT|FLOAT|DOUBLE|DECIMAL)/;

/**
 * Read a column as DOUBLE when the role map says it is numeric or the sniffer saw numbers; IDs and
 * categorical columns always as text (an ID "007" must not become 7). A value that then
 * fails to convert rejects its line, and the profile re-reads that column as text.
 */
export function typedColumns(
  header: readonly string[],
  roles: Roles,
  sniffed: readonly { column_name: string; column_type: string }[],
): Map<string, Storage> {
  const sniffedNumeric = new Set(sniffed.filter((t) => NUMERIC_TYPES.test(t.column_type)).map((t) => t.column_name));
  const ids = new Set([roles.group, roles.unit, roles.parent]);
  const storage = new Map<string, Storage>();
  for (const c of header) {
    const declared = roles.types[c];
    // a binary column the sniffer saw as text is written in words (yes/no): read as text, for the
    // reading plan to read its two words as 0/1 (plan/binary-words.ts)
    const isNumber = isNumberKind(declared) || (declared !== 'categorical' && sniffedNumeric.has(c));
    storage.set(c, !ids.has(c) && isNumber ? 'double' : 'text');
  }
  return storage;
}
