import { InputError, quoteName } from '../../errors.js';
import type { DuckLayout } from '../engines/duckdb/layout.js';
import type { CsvOptions } from '../engines/duckdb/read-csv.js';
import { readCsv, typedColumns } from '../engines/duckdb/read-csv.js';
import type { Storage } from '../sql.js';
import type { RejectedLine, SourceFormat } from '../types.js';
import { decimalCommaColumns } from './decimal-comma.js';
import { headerFields, withEdgeSpaces } from './header-line.js';
import type { ReadContext, ReadHost } from './registry.js';
import type { Utf8Check } from './utf8-advice.js';
import { encodingAdvice, mostlyNotUtf8 } from './utf8-advice.js';

/**
 * CSV/TSV: one sniff (DESCRIBE) gives the header and DuckDB's type guesses; the delivery is then
 * read with a type per column (text, or DOUBLE where the sniffer saw numbers) and missing tokens
 * as NULL (nullstr). Lines that cannot be read go to DuckDB's rejects table, with line numbers.
 * A Latin-1 or windows-1252 delivery is read from a UTF-8 copy (windows-1252.ts); a UTF-8 one
 * whose start is mostly not UTF-8 is an input error naming the likely encoding (utf8-check.ts).
 */
export async function csvLayout(ctx: ReadContext<ReadHost>, format: SourceFormat, delim: string | undefined): Promise<DuckLayout> {
  const { engine, display, roles, missing, files } = ctx;
  const { file, gzip, utf8 } = await readableCopy(ctx);
  let options: CsvOptions = {
    ...(delim !== undefined && { delim }),
    ...(gzip && !/\.gz$/i.test(file) ? { compression: 'gzip' as const } : {}),
    ...(ctx.options.decimalComma && { decimalSeparator: ',' as const }),
  };
  // the first megabyte, gzip undone: the header as written, and whether the text holds quotes
  const start = files.head(file, gzip);
  // decoded once: the header is read up to seven times below, a few milliseconds a decoding
  const startText = new TextDecoder().decode(start);
  refuseMultiLineHeader(startText, options.delim, display);
  const { all } = engine;
  // one sniff: the dialect and the columns with DuckDB's type guesses (from a sample: hints only)
  const sniff = (o: CsvOptions) =>
    all<Sniffed>(
      'SELECT Delimiter, Quote, Escape, NewLineDelimiter, SkipRows, Columns FROM ' +
        readCsv(file, missing, 'sniff', o).replace(/^read_csv\(/, 'sniff_csv('),
    )
      .then((rows) => rows[0])
      .catch((e: Error) => {
        if (utf8?.invalid)
          throw new InputError(`${display}: cannot read as ${format.toUpperCase()}: not UTF-8 text; ${encodingAdvice(utf8)}`);
        throw e;
      });
  const none = (v: string) => (v === '(empty)' ? '' : v);
  let found = await sniff(options);
  if (found.Quote === '"' && none(found.Escape) === '' && quotedQuoteInHeader(startText, options.delim ?? found.Delimiter)) {
    // a header name holding a quote ("a"",b") is a broken line to a sniff without an escape,
    // which it then skips (ignore_errors), taking the first record for the header: sniffed again
    // with RFC 4180's quoting
    found = await sniff({ ...options, quoting: { quote: '"', escape: '"' } });
  }
  let sniffed = found.Columns.map((c) => ({ column_name: c.name, column_type: c.type }));
  const dialect = {
    delim: options.delim ?? found.Delimiter,
    quote: none(found.Quote),
    escape: none(found.Escape),
    newline: none(found.NewLineDelimiter) || '\\n',
    skip: Number(found.SkipRows),
  };
  if (dialect.quote === '' && start.includes(0x22)) {
    // the sniffer read no quoting though the text holds quotes (some are broken, or only the
    // header quotes a name). Read as RFC 4180 ('"' quotes, '""' escapes), so that the good quoted
    // fields lose their quotes and the broken lines are rejected
    dialect.quote = '"';
    dialect.escape = '"';
    const written = headerFields(startText, dialect);
    if (written && written.length !== sniffed.length && new Set(written).size === written.length && written.every((w) => w.trim())) {
      // a quoted header name holds the delimiter, so the quote-less sniff split it: the header's
      // names, each with the type the sniff guessed for a column of that name (text otherwise)
      const guessed = new Map(sniffed.map((d) => [d.column_name, d.column_type]));
      sniffed = written.map((w) => ({ column_name: w, column_type: guessed.get(w.trim()) ?? 'VARCHAR' }));
    } else sniffed = sniffed.map((d) => ({ ...d, column_name: unquote(d.column_name) }));
  }
  // DuckDB trims the header's names: " pad " would be "pad", and a role map naming it as written refused
  sniffed = withEdgeSpaces(sniffed, headerFields(startText, dialect));
  options = { ...options, dialect };
  if (options.decimalSeparator && dialect.delim === ',') {
    throw new InputError(`${display}: numbers with a decimal comma need fields separated by something else than a comma`);
  }
  if (!options.decimalSeparator) {
    // decimal commas in a file separated by semicolons (or tabs): read when the first records
    // leave no doubt, so that the numbers are numbers (the report says they were read so)
    const text = new Map<string, Storage>(sniffed.map((d) => [d.column_name, 'text']));
    const found = await decimalCommaColumns(all, readCsv(file, missing, text, options, true), dialect.delim, sniffed, roles);
    if (found.length) {
      options = { ...options, decimalSeparator: ',' };
      sniffed = sniffed.map((d) => (found.includes(d.column_name) ? { ...d, column_type: 'DOUBLE' } : d));
    }
  }
  const header = sniffed.map((d) => d.column_name);
  const storage = typedColumns(header, roles, sniffed);
  return {
    path: display,
    format,
    header,
    storage,
    numbering: 'window',
    typedReader: true,
    ...(options.decimalSeparator && { reading: { decimalComma: true } }),
    ...(utf8?.invalid && { invalidUtf8: true }),
    relation: (s) => readCsv(file, missing, s, options),
    sample: () => readCsv(file, missing, storage, options, true),
    async rejects(): Promise<RejectedLine[]> {
      const rows = await all<{ line: bigint; error_message: string; error_type: string; column_name: string | null; lines: bigint }>(
        'SELECT line, error_message, error_type, column_name, len(string_split(rtrim(csv_line, chr(13) || chr(10)), chr(10))) AS ' +
          'lines FROM nr_rejects ' +
          'WHERE scan_id = (SELECT max(scan_id) FROM nr_rejects) ORDER BY line',
      ).catch(() => []); // no table: nothing was rejected
      // DuckDB may log one line more than once (a short line: once per missing field); a line
      // is listed once, with its first reason, and a CAST error once per column
      const seen = new Set<string>();
      const out: RejectedLine[] = [];
      for (const r of rows) {
        const cast = r.error_type === 'CAST' && r.column_name;
        const id = cast ? `${r.line}:cast:${r.column_name}` : `${r.line}`;
        if (seen.has(id)) continue;
        seen.add(id);
        // an unterminated quote runs on over the lines after it: they are part of this record
        const spans = Number(r.lines ?? 1) > 1 ? ` (it runs on to line ${Number(r.line) + Number(r.lines) - 1})` : '';
        // a line that is not UTF-8: say which encoding the file may be in, and the option
        const advice = utf8 && /not utf-8 encoded/i.test(r.error_message) ? `; ${encodingAdvice(utf8)}` : '';
        out.push({
          line: Number(r.line),
          reason: r.error_message.split('\n')[0] + spans + advice,
          kind: r.error_type,
          ...(cast ? { column: cast } : {}),
        });
      }
      return out;
    },
    async beforeRetype() {
      // a scan without rejects writes nothing to the rejects tables, so the previous pass's CAST
      // rejects would still read as the latest: start the log afresh for the re-read
      await engine.run('DROP TABLE IF EXISTS nr_rejects');
      await engine.run('DROP TABLE IF EXISTS nr_scans');
    },
  };
}

/**
 * The file DuckDB reads: the delivery itself, or a UTF-8 copy of a Latin-1/windows-1252 one, or
 * a copy with one kind of line end (DuckDB's reader takes one per file); with the UTF-8 check of
 * its first megabyte when it is read as UTF-8.
 */
async function readableCopy(ctx: ReadContext<ReadHost>): Promise<{ file: string; gzip: boolean; utf8: Utf8Check | null }> {
  const { engine, display, files } = ctx;
  let { file, gzip } = ctx;
  let utf8: Utf8Check | null = null;
  if ((ctx.options.encoding ?? 'utf-8') === 'utf-8') {
    utf8 = files.checkUtf8(file, gzip);
    if (mostlyNotUtf8(utf8)) {
      throw new InputError(
        `${display}: not UTF-8 text: ${utf8.invalid} of the ${utf8.nonAscii} lines with non-ASCII bytes in its first megabyte ` +
          `are invalid UTF-8; ${encodingAdvice(utf8)}`,
      );
    }
  } else {
    // Latin-1 is read as windows-1252, its superset in practice (WHATWG Encoding Standard): a
    // byte 0x80-0x9F in a file called Latin-1 is a ’ € –, never a control character
    const utf8File = await files.transcodeToUtf8(file, gzip);
    engine.cleanup.push(utf8File.dir);
    file = utf8File.file;
    gzip = false;
  }
  if (files.mixedLineEnds(file, gzip)) {
    const lf = await files.lfCopy(file, gzip);
    engine.cleanup.push(lf.dir);
    file = lf.file;
    gzip = false;
  }
  return { file, gzip, utf8 };
}

/** What sniff_csv says of a delimited text. */
interface Sniffed {
  Delimiter: string;
  Quote: string;
  Escape: string;
  NewLineDelimiter: string;
  SkipRows: number | bigint;
  Columns: { name: string; type: string }[];
}

/** Whether the header as RFC 4180 reads it names a column with a quote in it. */
function quotedQuoteInHeader(start: string, delim: string): boolean {
  return headerFields(start, { delim, quote: '"', escape: '"', skip: 0 })?.some((n) => n.includes('"')) ?? false;
}

/** A header name the quote-less sniff kept its quotes on. */
function unquote(name: string): string {
  return /^".*"$/.test(name) ? name.slice(1, -1).replace(/""/g, '"') : name;
}

/**
 * A header name that holds a line break inside its quotes: DuckDB's sniffer takes the header to
 * be one line, so such a file was refused with its sniffer's message or, worse, read with the
 * name's second line as a record. A NUL byte cannot be written in the SQL that names the column.
 * Both refused here, naming the column, before anything is read.
 */
function refuseMultiLineHeader(start: string, delim: string | undefined, display: string): void {
  // a TSV always names its tab; with the delimiter not yet known, each one the sniffer may choose
  const broken = (delim === undefined ? [',', ';', '\t', '|'] : [delim])
    .flatMap((d) => headerFields(start, { delim: d, quote: '"', escape: '"', skip: 0 }) ?? [])
    .find((n) => /[\r\n\0]/.test(n));
  if (broken !== undefined) {
    const what = broken.includes('\0') ? 'a NUL byte' : 'a line break';
    throw new InputError(
      `${display}: the header's column name ${quoteName(broken)} holds ${what}; write each column name on the header line ` +
        'in plain text and send the file again',
    );
  }
}
