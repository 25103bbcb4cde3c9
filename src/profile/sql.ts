import { ident, numeric } from '../source/sql.js';

export interface ProfileColumnPlan {
  name: string;
  numeric: boolean;
  distinct: boolean;
}

/** Aggregate key for column `c` and statistic `stat`, e.g. `visits:mean`. */
export function key(column: string, stat: string): string {
  return `${column}:${stat}`;
}

/**
 * The single profiling query: one GROUP BY over the delivery computing, per group, the
 * sufficient statistics of every column. Records with a missing group ID form the NULL group.
 */
export function profileQuery(view: string, group: string, plan: readonly ProfileColumnPlan[]): string {
  const aggs = ['count(*)::DOUBLE AS n'];
  for (const col of plan) {
    const c = ident(col.name);
    const as = (stat: string) => ident(key(col.name, stat));
    aggs.push(`count(${c})::DOUBLE AS ${as('nn')}`, `min(${c}) AS ${as('min')}`, `max(${c}) AS ${as('max')}`);
    if (col.distinct) aggs.push(`count(DISTINCT ${c})::DOUBLE AS ${as('nd')}`);
    if (col.numeric) {
      const x = numeric(col.name);
      aggs.push(
        `count(${x})::DOUBLE AS ${as('num')}`,
        `min(${x}) AS ${as('nmin')}`,
        `max(${x}) AS ${as('nmax')}`,
        `avg(${x}) AS ${as('mean')}`,
        // var_pop is computed stably by the engine; times n it is the within-group sum of squares
        `var_pop(${x}) * count(${x}) AS ${as('ss')}`,
      );
    }
  }
  const g = ident(group);
  return `SELECT ${g} AS "group", ${aggs.join(', ')} FROM ${view} GROUP BY ${g}`;
}
