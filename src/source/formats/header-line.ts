import type { CsvDialect } from '../engines/duckdb/read-csv.js';

type HeaderDialect = Pick<CsvDialect, 'delim' | 'quote' | 'escape' | 'skip'>;

/** Where the header record starts: past a byte-order mark and the `skip` lines; -1 when the text ends first. */
function headerStart(text: string, skip: number): number {
  let at = text.startsWith('\uFEFF') ? 1 : 0;
  for (let k = 0; k < skip && at >= 0; k++) {
    const nl = text.indexOf('\n', at);
    at = nl < 0 ? -1 : nl + 1;
  }
  return at;
}

/** A quoted field from its opening quote at `at`: its text and where it ends; null when it does not end. */
function quotedField(text: string, at: number, quote: string, esc: string): { value: string; end: number } | null {
  let value = '';
  for (let i = at + quote.length; i < text.length; ) {
    if (esc && text.startsWith(esc + quote, i)) {
      value += quote;
      i += esc.length + quote.length;
    } else if (text.startsWith(quote, i)) return { value, end: i + quote.length };
    else value += text[i++];
  }
  return null;
}

/**
 * The fields of a delimited text's header record as written, edge spaces kept, read with the
 * sniffed dialect from the start of the file (its first megabyte, gzip undone: as bytes, or as
 * text when the caller reads the header more than once). Null when the record does not end within it.
 */
export function headerFields(start: Uint8Array | string, dialect: HeaderDialect): string[] | null {
  const text = typeof start === 'string' ? start : new TextDecoder().decode(start);
  const { delim, quote } = dialect;
  const fields: string[] = [];
  let field = '';
  for (let at = headerStart(text, dialect.skip); at >= 0 && at < text.length; ) {
    if (quote && field === '' && text.startsWith(quote, at)) {
      const q = quotedField(text, at, quote, dialect.escape);
      if (!q) return null;
      field = q.value;
      at = q.end;
    } else if (text.startsWith(delim, at)) {
      fields.push(field);
      field = '';
      at += delim.length;
    } else if (text[at] === '\n' || text[at] === '\r') {
      fields.push(field);
      return fields;
    } else field += text[at++];
  }
  return null;
}

/**
 * The sniffed column names with the edge spaces the sniffer trimmed off given back, where the
 * header as written holds the same name padded: a role map names a column as its header writes
 * it. Kept as sniffed when the header cannot be matched field for field, or a padded name would
 * clash with another column's.
 */
export function withEdgeSpaces<T extends { column_name: string }>(sniffed: readonly T[], written: readonly string[] | null): T[] {
  if (!written || written.length !== sniffed.length) return [...sniffed];
  const names = new Set(sniffed.map((d) => d.column_name));
  return sniffed.map((d, i) => {
    const w = written[i];
    if (w === d.column_name || w.trim() !== d.column_name || names.has(w)) return d;
    names.add(w);
    return { ...d, column_name: w };
  });
}
