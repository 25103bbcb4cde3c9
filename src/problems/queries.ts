import { duckdb } from '../source/dialect.js';
import { modalValueSql } from '../source/modal-value.js';
import { ident, numericExpr } from '../source/sql.js';

/**
 * A bounded query for the records behind one finding, over the numbered delivery `d`. The
 * SQL for problem rows lives here; values are quoted by the src/source/sql helpers only.
 */
export interface RowQuery {
  /** common table expressions, or '' */
  with: string;
  /** `FROM nr_numbered d … WHERE …` */
  from: string;
  /** extra columns after rec, grp, unit: `value` and `expected` for level2-varies */
  extra: string;
}

/** The rows of a query: record number, group and unit ID as text, at most `limit`, in record order. */
export function selectSql(q: RowQuery, group: string, unit: string | undefined, limit: number): string {
  const u = unit ? `CAST(d.${ident(unit)} AS VARCHAR)` : 'NULL';
  return `${q.with} SELECT d.__rec AS rec, CAST(d.${ident(group)} AS VARCHAR) AS grp, ${u} AS unit${q.extra} ${q.from} ORDER BY d.__rec LIMIT ${limit}`;
}

/** How many rows the query has in all. */
export function countSql(q: RowQuery): string {
  return `${q.with} SELECT count(*) AS k ${q.from}`;
}

export function missingGroupQuery(numbered: string, group: string): RowQuery {
  return { with: '', from: `FROM ${numbered} d WHERE d.${ident(group)} IS NULL`, extra: '' };
}

export function singletonQuery(view: string, numbered: string, group: string): RowQuery {
  const g = ident(group);
  return {
    with: `WITH s AS (SELECT ${g} AS g FROM ${view} WHERE ${g} IS NOT NULL GROUP BY 1 HAVING count(*) = 1)`,
    from: `FROM ${numbered} d JOIN s ON d.${g} = s.g`,
    extra: '',
  };
}

export function listedRowsQuery(numbered: string, rows: readonly number[]): RowQuery {
  const list = rows.filter((r) => Number.isSafeInteger(r)).map(String);
  return { with: '', from: `FROM ${numbered} d WHERE d.__rec IN (${list.length ? list.join(', ') : 'NULL'})`, extra: '' };
}

/**
 * Records of a level-2 column that disagree with their group's most common value (ties: the
 * smaller value), in every group where the column is not constant. Numeric: beyond `tolerance`,
 * as level2-varies reads it; text (tolerance null): any other value.
 */
export function level2Query(view: string, numbered: string, group: string, column: string, tolerance: number | null): RowQuery {
  const g = ident(group);
  const c = ident(column);
  const v = tolerance === null ? c : numericExpr(c);
  const varies = tolerance === null ? `min(${v}) <> max(${v})` : `max(${v}) - min(${v}) > ${Number(tolerance)}`;
  const m = modalValueSql(view, group, column, tolerance, `${g} IN (SELECT g FROM bad)`, duckdb, numericExpr);
  return {
    with: `WITH bad AS (SELECT ${g} AS g FROM ${view} WHERE ${g} IS NOT NULL GROUP BY 1 HAVING ${varies}), ${m.cte}`,
    from: `FROM ${numbered} d JOIN m ON d.${g} = m.g WHERE d.${c} IS NOT NULL AND ${m.differs('d')}`,
    extra: `, d.${c} AS value, m.v AS expected`,
  };
}

/** Non-missing and numeric counts of a column over the whole delivery (to read it as the profile does). */
export function numericShareSql(view: string, column: string): string {
  const c = ident(column);
  return `SELECT count(${c}) AS nn, count(${numericExpr(c)}) AS num FROM ${view}`;
}
