import type { Dialect } from '../dialect.js';
import type { Storage } from '../sql.js';
import { finiteDouble, ident } from '../sql.js';

/** A numeric column and the points at which to count its values (one or more sets of edges). */
export interface SketchPlan {
  name: string;
  storage: Storage;
  edges: readonly number[];
}

/** A double as a literal both engines read back to the same double (the shortest round-trip text). */
function doubleLiteral(x: number, d: Dialect): string {
  return d.double(`'${String(x)}'`);
}

/** Key of the count of plan `i`'s values at or below its edge `k` (and `n`: its values that read as numbers). */
export function sketchKey(i: number, k: number | 'n'): string {
  return `s${i}_${k}`;
}

/**
 * One pass over the delivery counting, for each plan, the values at or below each of its edges:
 * the distribution sketches of the snapshot and, against a previous delivery, the current values
 * at the previous delivery's edges. The number of aggregates is bounded by the plans' edges, not
 * by the rows. Without `group` one row comes back; with it one row per group (its ID as `group`),
 * so that the counts can be summed over any set of groups.
 *
 * DuckDB counts each plan's values with one binned histogram (a binary search per value) rather
 * than one conditional count per edge, which cost several times more (docs/performance.md);
 * PostgreSQL has no binned histogram and keeps the conditional counts.
 */
export function sketchQuery(view: string, plans: readonly SketchPlan[], d: Dialect, group?: string): string {
  const inner: string[] = group === undefined ? [] : [`${ident(group)} AS "group"`];
  const aggs: string[] = [];
  const outer: string[] = [];
  const reading = new Map<string, string>();
  for (const [i, plan] of plans.entries()) {
    let x = reading.get(plan.name);
    if (!x) {
      x = `x${reading.size}`;
      reading.set(plan.name, x);
      const c = ident(plan.name);
      inner.push(`${plan.storage === 'double' ? finiteDouble(c) : d.numeric(c)} AS ${x}`);
    }
    const n = ident(sketchKey(i, 'n'));
    aggs.push(`${d.double(`count(${x})`)} AS ${n}`);
    outer.push(n);
    const edges = plan.edges.map((e) => doubleLiteral(e, d));
    if (d.name === 'duckdb') {
      // bucket k holds the values in (edge k−1, edge k]; a list of the counts, none above the last edge
      aggs.push(`map_values(histogram(${x}, [${edges.join(', ')}])) AS h${i}`);
      for (const k of plan.edges.keys()) outer.push(`coalesce(list_sum(h${i}[1:${k + 1}]), 0)::DOUBLE AS ${ident(sketchKey(i, k))}`);
    } else {
      for (const [k, edge] of edges.entries()) {
        const as = ident(sketchKey(i, k));
        aggs.push(`${d.double(`count(CASE WHEN ${x} <= ${edge} THEN 1 END)`)} AS ${as}`);
        outer.push(as);
      }
    }
  }
  const grouped = group === undefined ? '' : ' GROUP BY "group"';
  const key = group === undefined ? '' : '"group", ';
  const readings = [...inner, ...(d.fence ? [d.fence] : [])].join(', ');
  const counted = `SELECT ${key}${aggs.join(', ')} FROM (SELECT ${readings} FROM ${view}) AS nr_rows${grouped}`;
  return d.name === 'duckdb' ? `SELECT ${key}${outer.join(', ')} FROM (${counted}) AS nr_counts` : counted;
}
