import type { Dialect } from '../dialect.js';
import { ident } from '../sql.js';
import { key } from './profile-query.js';

/**
 * The per-group statistics of an (outcome, level-1 variable) pair, over the records where both
 * read as numbers: count, both means and the co-moments about them. The SQL standard's regr_*
 * aggregates compute them pairwise-complete, in DuckDB and PostgreSQL alike, and stably (they are
 * var_pop / covar_pop times the count, not raw sums of squares that cancel).
 */
export const PAIR_AGGREGATES = {
  n: 'regr_count',
  meanX: 'regr_avgx',
  meanY: 'regr_avgy',
  sxx: 'regr_sxx',
  syy: 'regr_syy',
  sxy: 'regr_sxy',
} as const;

export type PairStat = keyof typeof PAIR_AGGREGATES;

/**
 * Aggregate key of a pair statistic, e.g. `mathach:×ses:sxy`: the outcome's own statistics never
 * have a stat name starting with ×, so the two kinds of key cannot meet.
 */
export function pairKey(outcome: string, variable: string, stat: PairStat): string {
  return key(outcome, `×${variable}:${stat}`);
}

/**
 * The six aggregates of one pair in the profiling query.
 *
 * @param y the outcome's numeric reading in the inner select (e.g. `x3`)
 * @param x the variable's numeric reading in the inner select
 */
export function pairAggregates(y: string, x: string, outcome: string, variable: string, d: Dialect): string[] {
  return (Object.keys(PAIR_AGGREGATES) as PairStat[]).map((stat) => {
    const call = `${PAIR_AGGREGATES[stat]}(${y}, ${x})`;
    return `${d.double(call)} AS ${ident(pairKey(outcome, variable, stat))}`;
  });
}
