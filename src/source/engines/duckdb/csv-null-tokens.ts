import type { Storage } from '../../sql.js';
import { ident, literal } from '../../sql.js';

/**
 * Characters the CSV reader may take as a quote, an escape, a delimiter or a line end. DuckDB
 * refuses a NULL string that holds the quote or the delimiter (a Binder Error that would blame the
 * delivery for the role map), and the sniffer may pick any of these: a missing token holding one
 * is matched after the read instead.
 */
const READER_SYNTAX = /["'\\,;|\t\r\n]/;

/** The missing tokens the reader can take as its nullstr, and those matched after the read. */
export function splitNullTokens(missing: readonly string[], delim?: string): { reader: string[]; after: string[] } {
  const unsafe = (t: string) => READER_SYNTAX.test(t) || (delim !== undefined && delim !== '' && t.includes(delim));
  return { reader: missing.filter((t) => !unsafe(t)), after: missing.filter(unsafe) };
}

/**
 * The relation with the tokens the reader could not take read as NULL in its text columns
 * (whole-field match on the unquoted value, as nullstr does). A number column cannot hold such a
 * token: the value fails to convert, and the column is read again as text.
 */
export function withNullTokens(relation: string, storage: ReadonlyMap<string, Storage>, after: readonly string[]): string {
  const text = [...storage].filter(([, s]) => s === 'text').map(([c]) => ident(c));
  if (!after.length || !text.length) return relation;
  const tokens = after.map(literal).join(', ');
  const items = text.map((c) => `CASE WHEN ${c} IN (${tokens}) THEN NULL ELSE ${c} END AS ${c}`);
  return `(SELECT * REPLACE (${items.join(', ')}) FROM ${relation})`;
}
