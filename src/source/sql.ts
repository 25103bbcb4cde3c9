/**
 * Every piece of SQL nestready sends lives in src/source: quoting here, what differs between
 * engines in dialect.ts, engine detail in engines/. Values are always quoted by these helpers.
 */

export type Storage = 'text' | 'double';

/** Quote an identifier: "col ""x""". */
export function ident(name: string): string {
  return `"${name.replace(/"/g, '""')}"`;
}

/** Quote a string literal: 'it''s'. */
export function literal(value: string): string {
  return `'${value.replace(/'/g, "''")}'`;
}

/** A text column with values that are blank or a missing token once trimmed read as NULL. */
export function blankAsNull(column: string, missing: readonly string[]): string {
  const c = ident(column);
  const tokens = [...new Set(['', ...missing])].map(literal).join(', ');
  return `CASE WHEN trim(${c}) IN (${tokens}) THEN NULL ELSE ${c} END`;
}
