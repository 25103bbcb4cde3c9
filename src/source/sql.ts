/**
 * Every piece of SQL nestready sends lives in this folder, so that another engine can be
 * added as a dialect later. Values are always quoted by these helpers, never by callers.
 */

/** Quote an identifier: "col ""x""". */
export function ident(name: string): string {
  return `"${name.replace(/"/g, '""')}"`;
}

/** Quote a string literal: 'it''s'. */
export function literal(value: string): string {
  return `'${value.replace(/'/g, "''")}'`;
}

/** A column with the role map's missing tokens (compared after trimming) turned into NULL. */
export function cleaned(column: string, missing: readonly string[]): string {
  const c = ident(column);
  if (missing.length === 0) return c;
  const tokens = missing.map(literal).join(', ');
  return `CASE WHEN trim(${c}) IN (${tokens}) THEN NULL ELSE ${c} END`;
}

/** The numeric reading of a (cleaned) text column: NULL when it is not a number. */
export function numeric(column: string): string {
  return numericExpr(ident(column));
}

/** The numeric reading of any text expression. */
export function numericExpr(expr: string): string {
  return `TRY_CAST(trim(${expr}) AS DOUBLE)`;
}
