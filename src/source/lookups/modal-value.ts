import type { Dialect } from '../dialect.js';
import { ident } from '../sql.js';

/** The SQL of a group's modal value and of a record that differs from it. */
export interface ModalValueSql {
  /** a common table expression `m(g, v)`: each group's modal value, one row per group */
  cte: string;
  /** the condition that record alias `d`'s value differs from its group's `m.v` */
  differs(d: string): string;
}

/**
 * The value a group's records should share, and who departs from it. The modal (most common)
 * value is taken as the intended one, ties broken by the smaller value; with a tolerance the
 * column is compared as numbers (its numeric reading) and a record differs when it is further
 * than the tolerance from the mode, without one as written. One builder for the report's
 * example records (level2-varies, through the look-ups) and the problem-rows file, so that
 * both name the same records and the same expected value.
 *
 * @param from the relation to count values in
 * @param group the group column
 * @param column the column that should be constant within a group
 * @param tolerance numeric tolerance, or null to compare as written
 * @param groups a condition on `from`'s rows restricting the groups (e.g. `"g" IN (…)`)
 * @param d the SQL dialect
 * @param numeric the numeric reading of a column expression (as the profile reads the column)
 */
export function modalValueSql(
  from: string,
  group: string,
  column: string,
  tolerance: number | null,
  groups: string,
  d: Dialect,
  numeric: (expr: string) => string = d.numeric,
): ModalValueSql {
  const g = ident(group);
  const c = ident(column);
  const value = (expr: string) => (tolerance === null ? expr : numeric(expr));
  const order = tolerance === null ? d.ordered('v') : 'v';
  const present = `${groups} AND ${value(c)} IS NOT NULL`;
  const counted = `SELECT ${g} AS g, ${value(c)} AS v, count(*) AS k FROM ${from} WHERE ${present} GROUP BY 1, 2`;
  const ranked = `SELECT g, v, row_number() OVER (PARTITION BY g ORDER BY k DESC, ${order}) AS r FROM (${counted}) AS counted`;
  return {
    cte: `m AS (SELECT g, v FROM (${ranked}) AS ranked WHERE r = 1)`,
    differs: (rec) => (tolerance === null ? `${rec}.${c} <> m.v` : `abs(${value(`${rec}.${c}`)} - m.v) > ${Number(tolerance)}`),
  };
}
