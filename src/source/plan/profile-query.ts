import type { Dialect } from '../dialect.js';
import { duckdb } from '../dialect.js';
import type { Storage } from '../sql.js';
import { finiteDouble, ident } from '../sql.js';
import { pairAggregates } from './pair-aggregates.js';

export interface ProfileColumnPlan {
  name: string;
  storage: Storage;
  /** compute per-group numeric statistics (for a text column: of the values that read as numbers) */
  numberStats: boolean;
  /**
   * a text column's per-group min and max (equal ⇔ constant in the group); false for the unit
   * ID, whose constancy within a group no rule asks about (two string aggregates over every record)
   */
  textRange?: boolean;
  /** for an outcome: the level-1 variables whose per-group co-moments with it are asked for (src/profile/pairs.ts) */
  pairsWith?: readonly string[];
  /** per group, the values that read as 0 (a count outcome's zeros, against those its model expects) */
  zeros?: boolean;
  /** per group, the text values that match this pattern (src/profile/number-like.ts) */
  textPattern?: string;
}

/** Aggregate key for column `c` and statistic `stat`, e.g. `visits:mean`. */
export function key(column: string, stat: string): string {
  return `${column}:${stat}`;
}

/**
 * The single profiling query: one GROUP BY over the delivery computing, per group, the
 * sufficient statistics of every column. Records with a missing group ID form the NULL group.
 * Text columns get non-missing count and min/max (min = max ⇔ constant in the group); numeric
 * readings get count, min, max, mean and the within-group sum of squares. The same query runs
 * in DuckDB and in PostgreSQL: what differs between them goes through the dialect `d`.
 */
export function profileQuery(view: string, group: string, plan: readonly ProfileColumnPlan[], d: Dialect = duckdb): string {
  const inner = [`${ident(group)} AS "group"`];
  const aggs = [`${d.double('count(*)')} AS n`];
  plan.forEach((col, i) => {
    const as = (stat: string) => ident(key(col.name, stat));
    const c = ident(col.name);
    inner.push(`${c} AS t${i}`);
    aggs.push(`${d.double(`count(t${i})`)} AS ${as('nn')}`);
    if (col.storage === 'text' && col.textRange !== false)
      aggs.push(`min(${d.ordered(`t${i}`)}) AS ${as('min')}`, `max(${d.ordered(`t${i}`)}) AS ${as('max')}`);
    if (col.storage === 'text' && col.textPattern)
      aggs.push(`${d.double(`count(CASE WHEN ${d.matches(`t${i}`, col.textPattern)} THEN 1 END)`)} AS ${as('like')}`);
    if (!col.numberStats) return;
    // the numeric reading is taken once here, not once per aggregate; a DOUBLE column goes
    // through it too, so that ±inf, NaN and overflowing values are not numbers in any column
    const x = `x${i}`;
    inner.push(`${col.storage === 'double' ? finiteDouble(c) : d.numeric(c)} AS x${i}`);
    aggs.push(
      `${d.double(`count(${x})`)} AS ${as('num')}`,
      `min(${x}) AS ${as('nmin')}`,
      `max(${x}) AS ${as('nmax')}`,
      `avg(${x}) AS ${as('mean')}`,
      // var_pop is computed stably by the engine; times n it is the within-group sum of squares
      `var_pop(${x}) * count(${x}) AS ${as('ss')}`,
    );
    if (col.zeros) aggs.push(`${d.double(`count(CASE WHEN ${x} = 0 THEN 1 END)`)} AS ${as('zeros')}`);
  });
  plan.forEach((col, i) => {
    for (const other of col.numberStats ? (col.pairsWith ?? []) : []) {
      const k = plan.findIndex((p) => p.name === other && p.numberStats);
      if (k >= 0) aggs.push(...pairAggregates(`x${i}`, `x${k}`, col.name, other, d));
    }
  });
  // ordered by the engine (byte order, the missing-ID group first), so the profile need not sort
  return (
    `SELECT "group", ${aggs.join(', ')} FROM (SELECT ${[...inner, ...(d.fence ? [d.fence] : [])].join(', ')} FROM ${view}) AS nr_rows ` +
    'GROUP BY "group" ' +
    `ORDER BY ${d.ordered('"group"')} NULLS FIRST`
  );
}
