import { ident, numeric } from '../source/sql.js';
import type { Storage } from '../source/sql.js';

export interface ProfileColumnPlan {
  name: string;
  storage: Storage;
  /** compute per-group numeric statistics (for a text column: of the values that read as numbers) */
  numeric: boolean;
}

/** Aggregate key for column `c` and statistic `stat`, e.g. `visits:mean`. */
export function key(column: string, stat: string): string {
  return `${column}:${stat}`;
}

/**
 * The single profiling query: one GROUP BY over the delivery computing, per group, the
 * sufficient statistics of every column. Records with a missing group ID form the NULL group.
 * Text columns get non-missing count and min/max (min = max ⇔ constant in the group); numeric
 * readings get count, min, max, mean and the within-group sum of squares.
 */
export function profileQuery(view: string, group: string, plan: readonly ProfileColumnPlan[]): string {
  const inner = [`${ident(group)} AS "group"`];
  const aggs = ['count(*)::DOUBLE AS n'];
  plan.forEach((col, i) => {
    const as = (stat: string) => ident(key(col.name, stat));
    const c = ident(col.name);
    inner.push(`${c} AS t${i}`);
    aggs.push(`count(t${i})::DOUBLE AS ${as('nn')}`);
    if (col.storage === 'text') aggs.push(`min(t${i}) AS ${as('min')}`, `max(t${i}) AS ${as('max')}`);
    if (!col.numeric) return;
    // a text column's numeric reading is cast once here, not once per aggregate
    const x = col.storage === 'double' ? `t${i}` : `x${i}`;
    if (col.storage === 'text') inner.push(`${numeric(col.name)} AS x${i}`);
    aggs.push(
      `count(${x})::DOUBLE AS ${as('num')}`,
      `min(${x}) AS ${as('nmin')}`,
      `max(${x}) AS ${as('nmax')}`,
      `avg(${x}) AS ${as('mean')}`,
      // var_pop is computed stably by the engine; times n it is the within-group sum of squares
      `var_pop(${x}) * count(${x}) AS ${as('ss')}`,
    );
  });
  return `SELECT "group", ${aggs.join(', ')} FROM (SELECT ${inner.join(', ')} FROM ${view}) GROUP BY "group"`;
}
