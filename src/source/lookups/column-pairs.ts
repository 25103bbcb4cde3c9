import { finiteDouble, ident } from '../sql.js';
import type { Source } from '../types.js';
import type { ColumnScreen, ColumnValueStats } from './types.js';

/**
 * How many distinct values each column has, in how many groups it has a value, and how many of
 * its values are not whole numbers (numbers only): one aggregate over the delivery for all the
 * columns, so that columns with a value per record are dropped before their values are grouped.
 */
export async function screenColumns(source: Source, group: string, columns: readonly string[]): Promise<ColumnScreen[]> {
  if (!columns.length) return [];
  const g = ident(group);
  const aggs = columns.flatMap((column, i) => {
    const c = ident(column);
    const parts = [
      `count(DISTINCT ${c}) AS d${i}`,
      `count(${c}) AS n${i}`,
      `count(DISTINCT CASE WHEN ${c} IS NOT NULL THEN ${g} END) AS j${i}`,
    ];
    if (source.storage.get(column) === 'double') parts.push(`count(CASE WHEN ${c} <> round(${c}) THEN 1 END) AS f${i}`);
    return parts;
  });
  const [row] = await source.all<Record<string, unknown>>(`SELECT ${aggs.join(', ')} FROM ${source.view} WHERE ${g} IS NOT NULL`);
  return columns.map((column, i) => ({
    column,
    values: Number(row[`d${i}`]),
    nonMissing: Number(row[`n${i}`]),
    groups: Number(row[`j${i}`]),
    fractional: row[`f${i}`] === undefined ? 0 : Number(row[`f${i}`]),
  }));
}

/**
 * Per value of each column: the distinct groups it occurs in and, per outcome, the count, mean
 * and sum of squares of the outcome's values. One query (a UNION ALL of one GROUP BY per column)
 * whose output is one row per value, so the caller bounds it by the columns' distinct counts.
 */
export async function columnValueStats(
  source: Source,
  group: string,
  columns: readonly string[],
  outcomes: readonly string[],
): Promise<ColumnValueStats[]> {
  if (!columns.length) return [];
  const g = ident(group);
  const d = source.dialect;
  const reading = (column: string) => (source.storage.get(column) === 'double' ? finiteDouble(ident(column)) : d.numeric(ident(column)));
  const ys = outcomes.map((o, k) => `${reading(o)} AS y${k}`);
  const stats = outcomes.flatMap((_, k) => [`count(y${k}) AS n${k}`, `avg(y${k}) AS m${k}`, `var_pop(y${k}) * count(y${k}) AS s${k}`]);
  const parts = columns.map((column, i) => {
    const c = ident(column);
    const picked = [`${d.text(c)} AS v`, `${g} AS g`, ...ys].join(', ');
    const inner = `SELECT ${picked} FROM ${source.view} WHERE ${g} IS NOT NULL AND ${c} IS NOT NULL`;
    return `SELECT ${i} AS c, v, count(DISTINCT g) AS k${stats.map((s) => `, ${s}`).join('')} FROM (${inner}) AS r${i} GROUP BY v`;
  });
  const rows = await source.all<Record<string, unknown>>(`${parts.join(' UNION ALL ')} ORDER BY 1, 2`);
  return rows.map((r) => ({
    column: columns[Number(r.c)],
    groups: Number(r.k),
    outcomes: outcomes.map((_, k) => ({
      n: Number(r[`n${k}`]),
      mean: r[`m${k}`] === null ? NaN : Number(r[`m${k}`]),
      ss: r[`s${k}`] === null ? 0 : Math.max(0, Number(r[`s${k}`])),
    })),
  }));
}
