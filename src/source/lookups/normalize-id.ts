import type { Dialect } from '../dialect.js';

/**
 * The key two IDs share when they are "the same ID written differently": surrounding spaces
 * removed; an ID that reads as a number of at most 15 characters becomes that number ("12",
 * "12.0", "012" → 12); otherwise case-folded with leading zeros stripped ("W-014 " → "w-014",
 * "007a" → "7a"). The SQL in unitIds applies the same rule (normalizedIdQuery).
 *
 * @param raw the ID as written
 * @returns its normalised key
 */
export function normalizeId(raw: string): string {
  const t = raw.replace(/^ +| +$/g, '');
  if (t.length <= 15 && NUMBER.test(t)) return `#${Number(t)}`;
  return t.toLowerCase().replace(/^0+/, '');
}
const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i;

/**
 * The SQL form of normalizeId: the records of `from` with a non-missing ID `expr`, their
 * `columns`, and the key as two columns: `kd`, the number an ID of at most 15 characters reads
 * as (the dialect's numeric reading: in DuckDB a TRY_CAST, no regular expression per record,
 * since this runs over every unit ID), else NULL; `ks`, the case-folded ID without leading zeros
 * when it is not a number. Keying on both avoids formatting numbers as text. Both numeric
 * readings skip surrounding spaces themselves, so the ID is trimmed only where the numeric
 * reading cannot tell (an ID over 15 characters with spaces around it) and for `ks`, which is
 * measurably faster over millions of IDs than trimming every ID first (docs/performance.md).
 */
export function normalizedIdQuery(from: string, columns: string, expr: string, d: Dialect): string {
  const ids = `SELECT ${columns}, ${expr} AS x FROM ${from} WHERE ${expr} IS NOT NULL`;
  const read = `SELECT *, CASE WHEN length(x) <= 15 OR length(trim(x)) <= 15 THEN ${d.numeric('x')} END AS kd FROM (${ids}) AS ids`;
  return `SELECT *, CASE WHEN kd IS NULL THEN ltrim(lower(trim(x)), '0') END AS ks FROM (${read}) AS read`;
}
