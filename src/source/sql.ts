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

/** The numeric reading of a text column: NULL when it is not a number. */
export function numeric(column: string): string {
  return numericExpr(ident(column));
}

/**
 * Beyond this magnitude a value is not read as a number: sums of squares over any delivery must
 * stay finite (1e308 twice overflows a mean; squares of 1e200 overflow a variance). `inf`, `-inf`
 * and `nan` are never numbers either: they are listed like other tokens that are not numbers.
 */
export const MAX_MAGNITUDE = '1e100';

/** A column already read as double, with ±inf, NaN and values beyond ±MAX_MAGNITUDE as NULL (any engine). */
export function finiteDouble(expr: string): string {
  // NaN compares above every number in DuckDB and PostgreSQL alike, so the range test is false for it
  return `(CASE WHEN ${expr} BETWEEN -${MAX_MAGNITUDE} AND ${MAX_MAGNITUDE} THEN ${expr} END)`;
}

/** The numeric reading of any expression: NULL unless a finite number within ±MAX_MAGNITUDE. */
export function numericExpr(expr: string): string {
  // NaN compares above every number in DuckDB, so the range test is false for it as for ±inf;
  // BETWEEN rather than abs(): a comparison is nearly free beside the aggregates, a function call is not
  return `(CASE WHEN TRY_CAST(${expr} AS DOUBLE) BETWEEN -${MAX_MAGNITUDE} AND ${MAX_MAGNITUDE} THEN TRY_CAST(${expr} AS DOUBLE) END)`;
}
